import { describe, expect, it } from 'vitest'
import { checkCreatePayloadSchema } from '@shared/schemas/checks'
import { combinedNotes, toCheckCreatePayload } from '@/db/checkRecords'
import { buildBundle, type BundleInput } from '../logic/bundle'
import { buildReport } from '../logic/report'
import { context, measurement, region } from './samples'

// From a finished check to the records saved on the device and the `check.create` payload.

const CHECK_ID = '7d1f3c2a-4b5e-4f60-8a71-92b3c4d5e6f7'

function input(
  regions = [
    region(measurement(0.16)),
    region(measurement(0.14)),
    region(measurement(0.3), { enabled: false }),
    region(measurement(0.4, { warnings: ['clipping'] })),
  ],
): BundleInput {
  const cropped: number[] = []
  return {
    id: CHECK_ID,
    cameraId: 1,
    userId: 4,
    roundId: null,
    capturedAt: '2025-05-02T10:00:00.000Z',
    mode: 'day',
    report: buildReport(regions, 'day', context(), null),
    regions,
    frame: {
      file: new Blob([new Uint8Array(1000)], { type: 'image/png' }),
      name: 'gate-1.png',
      header: { format: 'png', width: 1280, height: 800, bitDepth: 8 },
    },
    frameSize: { width: 1280, height: 800, orientation: 1 },
    notes: { notes: ' Lens cover cracked ', exposureNote: '1/100 s', lensNote: '' },
    target: { id: 'SFT-7K2M9Q', widthMm: 297 },
    shareFrame: false,
    isBaseline: false,
    otherModeMtf50CyPx: null,
    crop: async (roi) => {
      cropped.push(roi.x)
      return new Blob([new Uint8Array(10)], { type: 'image/png' })
    },
    now: new Date('2025-05-02T10:05:00.000Z'),
  }
}

describe('saving a finished check', () => {
  it('keeps every measured region, and crops only the ones the verdict used', async () => {
    const b = await buildBundle(input())
    expect(b.check).toMatchObject({
      id: CHECK_ID,
      verdict: 'fail',
      medianMtf50CyPx: expect.closeTo(0.15, 12),
      savedAt: '2025-05-02T10:05:00.000Z',
      notes: 'Lens cover cracked',
      exposureNote: '1/100 s',
      lensNote: null,
      targetId: 'SFT-7K2M9Q',
      frame: { name: 'gate-1.png', mime: 'image/png', width: 1280, height: 800, bytes: 1000 },
    })
    expect(b.measurements.map((m) => [m.index, m.enabled, m.valid])).toEqual([
      [1, true, true],
      [2, true, true],
      [3, false, true],
      [4, true, false],
    ])
    expect(b.crops.map((c) => c.id)).toEqual(b.measurements.slice(0, 2).map((m) => m.id))
    expect(b.crops[0]).toMatchObject({
      checkId: CHECK_ID,
      kind: 'roi',
      mime: 'image/png',
      encoding: 'srgb',
    })
    expect(b.frame).toMatchObject({ checkId: CHECK_ID, share: false, mime: 'image/png' })
  })

  it('saves the check even when a crop cannot be made', async () => {
    const i = input()
    i.crop = async () => {
      throw new Error('worker gone')
    }
    const b = await buildBundle(i)
    expect(b.crops).toEqual([])
    expect(b.measurements).toHaveLength(4)
  })

  it('refuses an inconclusive check', async () => {
    await expect(buildBundle(input([region(null)]))).rejects.toThrow(/inconclusive/)
  })

  it('becomes a check.create payload that the server’s schema accepts, with the used edges only', async () => {
    const b = await buildBundle(input())
    const payload = toCheckCreatePayload(b.check, b.measurements, 3)
    expect(checkCreatePayloadSchema.safeParse(payload).success).toBe(true)
    expect(payload.measurements.map((m) => m.mtf50CyPx)).toEqual([0.16, 0.14])
    expect(payload).toMatchObject({
      id: CHECK_ID,
      cameraId: 1,
      verdict: 'fail',
      cameraVersion: 3,
      notes: 'Lens cover cracked\nExposure: 1/100 s',
      pixelDensityPxPerM: expect.closeTo(137.93, 2),
      shareFrame: false,
    })
    expect(payload.reasons[0]).toMatchObject({ code: 'edges-rejected', severity: 'info' })
    expect(payload.measurements[0].mtfCurve).toHaveLength(101)
  })

  it('joins the notes into the one field the server keeps', () => {
    expect(combinedNotes({ notes: null, exposureNote: ' ', lensNote: 'zoom 8 mm' })).toBe(
      'Lens: zoom 8 mm',
    )
    expect(combinedNotes({ notes: '', exposureNote: null, lensNote: null })).toBeNull()
  })
})
