// Turns the finished check (report, regions, frame, notes) into the records saved on the device.
import { toRaw } from 'vue'
import type { Roi } from '@shared/analysis'
import type { CheckMode, Verdict } from '@shared/schemas/enums'
import type { CheckBundle } from '@/db/checkRecords'
import type { CropRecord, MeasurementRecord } from '@/db/checks'
import type { AcceptedFrame } from '@/composables/useFrameCapture'
import type { FrameInfo } from '@/workers/types'
import { isValidRegion, type RegionState } from './regionRules'
import type { CheckReport } from './report'

export interface BundleInput {
  id: string
  cameraId: number
  userId: number
  roundId: number | null
  capturedAt: string
  mode: CheckMode
  report: CheckReport
  regions: readonly RegionState[]
  frame: AcceptedFrame
  /** Size of the frame as analysed (EXIF orientation applied). */
  frameSize: Pick<FrameInfo, 'width' | 'height' | 'orientation'> | null
  notes: { notes: string; exposureNote: string; lensNote: string }
  target: { id: string; widthMm: number | null }
  shareFrame: boolean
  isBaseline: boolean
  otherModeMtf50CyPx: number | null
  /** The region's original pixels as PNG (the worker); a failure leaves that crop out. */
  crop: (roi: Roi) => Promise<Blob>
  now?: Date
}

const text = (s: string) => (s.trim() ? s.trim() : null)

export async function buildBundle(input: BundleInput): Promise<CheckBundle> {
  const { report, frame } = input
  const verdict = report.verdict.verdict
  if (verdict === 'inconclusive') {
    throw new RangeError('An inconclusive check has no verdict to save.')
  }
  const measurements: MeasurementRecord[] = []
  input.regions.forEach((region, index) => {
    // Plain copies: IndexedDB cannot store Vue's reactive proxies.
    const r = toRaw(region)
    if (r.status !== 'measured' || !r.measurement) return
    measurements.push({
      id: r.id,
      checkId: input.id,
      index: index + 1,
      source: r.source,
      enabled: r.enabled,
      valid: isValidRegion(r),
      measurement: structuredClone(toRaw(r.measurement)),
      profile: r.profile ? structuredClone(toRaw(r.profile)) : null,
    })
  })
  const crops: CropRecord[] = []
  for (const m of measurements) {
    if (!m.enabled || !m.valid) continue
    try {
      const blob = await input.crop(m.measurement.roi)
      crops.push({
        id: m.id,
        checkId: input.id,
        kind: 'roi',
        blob,
        mime: 'image/png',
        width: m.measurement.roi.w,
        height: m.measurement.roi.h,
        encoding: 'srgb',
      })
    } catch {
      // The check stands without that crop; the server then has nothing to re-check for it.
    }
  }
  const width = input.frameSize?.width ?? frame.header.width
  const height = input.frameSize?.height ?? frame.header.height
  const mime = frame.header.format === 'png' ? 'image/png' : 'image/jpeg'
  return {
    check: {
      id: input.id,
      cameraId: input.cameraId,
      userId: input.userId,
      roundId: input.roundId,
      capturedAt: input.capturedAt,
      savedAt: (input.now ?? new Date()).toISOString(),
      mode: input.mode,
      verdict: verdict as Verdict,
      reasons: structuredClone(toRaw(report.verdict.reasons)),
      thresholds: { ...report.verdict.thresholds },
      medianMtf50CyPx: report.medianMtf50CyPx,
      pixelDensity: report.density
        ? {
            pxPerM: report.density.pxPerM,
            source: report.density.source,
            detail: report.density.detail,
          }
        : null,
      baselineMtf50CyPx:
        report.baselineRatio && report.medianMtf50CyPx
          ? report.medianMtf50CyPx / report.baselineRatio
          : null,
      baselineRatio: report.baselineRatio,
      otherModeMtf50CyPx: input.otherModeMtf50CyPx,
      targetId: text(input.target.id),
      targetWidthMm: input.target.widthMm,
      notes: text(input.notes.notes),
      exposureNote: text(input.notes.exposureNote),
      lensNote: text(input.notes.lensNote),
      shareFrame: input.shareFrame,
      isBaseline: input.isBaseline,
      frame: {
        name: frame.name,
        mime,
        bytes: frame.file.size,
        width,
        height,
        orientation: input.frameSize?.orientation ?? 1,
      },
      representativeId: report.representativeId,
    },
    measurements,
    frame: { checkId: input.id, blob: frame.file, mime, width, height, share: input.shareFrame },
    crops,
  }
}
