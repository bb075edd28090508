import QRCode from 'qrcode'
import type { RectMm } from '@shared/target/geometry'
import { targetLayout, type TargetLayout } from '@shared/target/layout'
import { qrModuleRects, type QrMatrix } from '@shared/target/qrModules'
import type { Sheet } from '@shared/target/sheets'

/** Everything drawn on a target sheet: the layout plus the QR code's dark modules. */
export interface TargetDrawing {
  layout: TargetLayout
  qrRects: RectMm[]
}

/** QR symbol for a payload, error correction level M (about 15 % of the symbol may be damaged). */
export function qrMatrixFor(text: string): QrMatrix {
  return QRCode.create(text, { errorCorrectionLevel: 'M' }).modules
}

export function targetDrawing(sheet: Sheet, targetId: string): TargetDrawing {
  const layout = targetLayout(sheet, targetId)
  return { layout, qrRects: qrModuleRects(qrMatrixFor(layout.payload), layout.qrBox) }
}
