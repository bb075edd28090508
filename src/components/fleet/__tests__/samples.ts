// An invented check as GET /api/fleet/checks/:id returns it, and the attachments list of
// GET /api/checks/:id/attachments, for the fleet restoration tests. Both go through the shared
// schemas, so a sample the server could not send fails here.
import { attachmentSchema, type Attachment } from '@shared/schemas/checks'
import { checkDetailSchema, type CheckDetail, type CheckMeasurement } from '@shared/schemas/fleet'

export const CHECK_ID = '5b0e8f6a-3c1d-4e2f-9a7b-1c2d3e4f5a6b'

type MeasurementInput = Partial<Omit<CheckMeasurement, 'psf'>> & {
  psf?: CheckMeasurement['psf']
}

export function detailMeasurement(m: MeasurementInput = {}): CheckMeasurement {
  return {
    id: crypto.randomUUID(),
    roi: { x: 100, y: 80, w: 120, h: 100 },
    orientation: 'vertical',
    angleDeg: 5.1,
    mtf50CyPx: 0.3,
    mtf50pCyPx: 0.3,
    mtf10CyPx: 0.6,
    mtfNyquist: 0.12,
    rise1090Px: 1.9,
    overshoot: 0,
    noise: 0.004,
    psf: { model: 'gaussian', sigmaPx: 0.62, radiusPx: null, rmsResidual: 0.003 },
    mtfCurve: [
      [0, 1],
      [0.5, 0.1],
    ],
    warnings: [],
    serverMtf50CyPx: null,
    disagreement: false,
    ...m,
  }
}

export function checkDetail(
  measurements: CheckMeasurement[],
  overrides: Partial<CheckDetail> = {},
): CheckDetail {
  return checkDetailSchema.parse({
    id: CHECK_ID,
    camera: {
      id: 7,
      assetTag: 'QW-GATE-07',
      siteName: 'Quarry Wharf',
      siteTimeZone: 'Europe/Dublin',
      locationText: 'Gate 2, mast',
      taskId: 'recognise',
      taskName: 'Recognise',
      cameraModelName: 'Invented 4 MP bullet',
      minMtf50CyPx: 0.25,
      requiredPxPerM: 125,
    },
    inspector: { id: 4, name: 'Ines Okafor' },
    roundId: null,
    capturedAt: '2025-03-04T09:30:00.000Z',
    mode: 'day',
    verdict: 'pass',
    reasons: [{ code: 'sharpness', text: 'Median MTF50 meets the minimum.' }],
    medianMtf50CyPx: 0.3,
    pixelDensityPxPerM: 320,
    baselineRatio: null,
    targetId: null,
    notes: null,
    isBaseline: false,
    syncedAt: '2025-03-04T09:40:00.000Z',
    measurements,
    ...overrides,
  })
}

let minute = 0
/** An uploaded file of the check (a region crop of `m` unless told otherwise). */
export function attachment(
  m: CheckMeasurement | null,
  overrides: Partial<Attachment> = {},
): Attachment {
  minute++
  return attachmentSchema.parse({
    id: crypto.randomUUID(),
    checkId: CHECK_ID,
    measurementId: m?.id ?? null,
    kind: m ? 'roi' : 'frame',
    sha256: 'a'.repeat(64),
    bytes: 5120,
    mime: 'image/png',
    width: m?.roi.w ?? 1280,
    height: m?.roi.h ?? 800,
    deleteAfter: null,
    createdAt: new Date(Date.UTC(2025, 2, 4, 9, 40 + minute)).toISOString(),
    ...overrides,
  })
}
