import { describe, expect, it, vi } from 'vitest'
import { restorationRequestOf } from '@/components/check/logic/restorationSource'
import {
  NO_KERNEL_REASON,
  representativeEdge,
  uploadedRestoration,
  uploadedSourceOf,
  type RestorableEdge,
} from '../uploadedRestoration'
import { attachment, checkDetail, detailMeasurement } from './samples'

// Which edges of a check on the server get the restoration preview on a supervisor's screen,
// and the request that preview sends to the worker. Invented checks (samples.ts).

describe('a check on the server', () => {
  it('with no region crop uploaded keeps the preview on the device', () => {
    const m = detailMeasurement()
    const check = checkDetail([m])
    expect(uploadedRestoration(check, [])).toEqual({ kind: 'none' })
    // A shared full frame is not a region crop.
    expect(uploadedRestoration(check, [attachment(null)])).toEqual({ kind: 'none' })
  })

  it('offers every edge with an uploaded crop and a measured kernel, numbered as in its table', () => {
    const a = detailMeasurement({ mtf50CyPx: 0.21 })
    const b = detailMeasurement({ mtf50CyPx: 0.3, orientation: 'horizontal' })
    const c = detailMeasurement({ mtf50CyPx: 0.33 })
    const check = checkDetail([a, b, c], { medianMtf50CyPx: 0.3 })
    const r = uploadedRestoration(check, [attachment(a), attachment(c), attachment(b)])
    expect(r.kind).toBe('edges')
    if (r.kind !== 'edges') return
    expect(r.edges.map((e) => [e.number, e.measurementId])).toEqual([
      [1, a.id],
      [2, b.id],
      [3, c.id],
    ])
    // The edge nearest the median MTF50: the one the device restores.
    expect(r.representative.measurementId).toBe(b.id)
    expect(r.representative.orientation).toBe('horizontal')
  })

  it('leaves out edges without a crop, without a kernel size, or whose crop is not their region', () => {
    const noCrop = detailMeasurement()
    const noPsf = detailMeasurement({ psf: null })
    const noSigma = detailMeasurement({
      psf: { model: 'gaussian', sigmaPx: null, radiusPx: 2, rmsResidual: null },
    })
    const otherSize = detailMeasurement()
    const disk = detailMeasurement({
      psf: { model: 'disk', sigmaPx: null, radiusPx: 2.4, rmsResidual: 0.01 },
    })
    const check = checkDetail([noCrop, noPsf, noSigma, otherSize, disk])
    const r = uploadedRestoration(check, [
      attachment(noPsf),
      attachment(noSigma),
      attachment(otherSize, { width: 64 }),
      attachment(disk),
    ])
    expect(r.kind === 'edges' && r.edges.map((e) => e.number)).toEqual([5])
  })

  it('says why when crops were uploaded but no edge has a kernel to restore with', () => {
    const m = detailMeasurement({ psf: null })
    expect(uploadedRestoration(checkDetail([m]), [attachment(m)])).toEqual({
      kind: 'unavailable',
      reason: NO_KERNEL_REASON,
    })
  })

  it('uses the newest upload of a region', () => {
    const m = detailMeasurement()
    const older = attachment(m)
    const newer = attachment(m, { sha256: 'b'.repeat(64) })
    const r = uploadedRestoration(checkDetail([m]), [older, newer])
    expect(r.kind === 'edges' && r.representative.crop.id).toBe(newer.id)
  })
})

describe('the representative edge', () => {
  const edge = (n: number, mtf50CyPx: number) => ({ number: n, mtf50CyPx }) as RestorableEdge

  it('is the edge nearest the median, the first of two equally near', () => {
    // Dyadic values, so the distances are exact: |0.25 − 0.5| = |0.75 − 0.5| = 0.25.
    expect(representativeEdge([edge(1, 0.125), edge(2, 0.75), edge(3, 0.25)], 0.5)?.number).toBe(2)
    expect(representativeEdge([edge(1, 0.125), edge(2, 0.4), edge(3, 0.75)], 0.5)?.number).toBe(2)
    expect(representativeEdge([], 0.5)).toBeNull()
  })

  it('without a stored median, is nearest the median of the edges themselves', () => {
    // Median of 0.5, 0.1, 0.2 is 0.2 (the middle value once sorted): the third edge.
    expect(representativeEdge([edge(1, 0.5), edge(2, 0.1), edge(3, 0.2)], null)?.number).toBe(3)
    // Median of 0.875, 0.75, 0.125, 0.25 is (0.25 + 0.75) / 2 = 0.5: edges 2 and 4 are equally
    // near and the first of them is taken.
    const four = [edge(1, 0.875), edge(2, 0.75), edge(3, 0.125), edge(4, 0.25)]
    expect(representativeEdge(four, null)?.number).toBe(2)
  })
})

describe('the pixels and request of an uploaded crop', () => {
  it('are the whole crop, fetched when asked, with the measured kernel and noise', async () => {
    const m = detailMeasurement({
      noise: 0.0123,
      psf: { model: 'disk', sigmaPx: null, radiusPx: 2.4, rmsResidual: 0.01 },
    })
    const crop = attachment(m)
    const r = uploadedRestoration(checkDetail([m]), [crop])
    if (r.kind !== 'edges') throw new Error(`expected edges, got ${r.kind}`)
    const blob = new Blob([new Uint8Array([137, 80, 78, 71])], { type: 'image/png' })
    const fetchCrop = vi.fn(async () => blob)
    const source = uploadedSourceOf(r.representative, fetchCrop)
    if (!source.available || typeof source.image !== 'function') throw new Error('no loader')
    expect(source.from).toBe('upload')
    expect(source.roi).toEqual({ x: 0, y: 0, w: 120, h: 100 })
    expect(fetchCrop).not.toHaveBeenCalled()
    expect(await source.image()).toBe(blob)
    expect(fetchCrop).toHaveBeenCalledWith(crop.id)
    expect(restorationRequestOf(source.measurement, source.roi, 'wiener')).toEqual({
      roi: { x: 0, y: 0, w: 120, h: 100 },
      model: 'disk',
      sizePx: 2.4,
      method: 'wiener',
      noiseSigma: 0.0123,
    })
  })

  it('without a stored noise, leave the noise to the worker to estimate', () => {
    const m = detailMeasurement({ noise: null })
    const r = uploadedRestoration(checkDetail([m]), [attachment(m)])
    if (r.kind !== 'edges') throw new Error(`expected edges, got ${r.kind}`)
    const req = restorationRequestOf(
      r.representative.kernel,
      { x: 0, y: 0, w: 120, h: 100 },
      'wiener',
    )
    expect(req.noiseSigma).toBeUndefined()
    expect(req.sizePx).toBe(0.62)
  })
})
