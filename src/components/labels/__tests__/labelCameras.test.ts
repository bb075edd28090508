import { describe, expect, it } from 'vitest'
import type { FleetCameraRow } from '@shared/schemas/fleet'
import { collectLabelCameras, LABEL_FETCH_PAGE, type CameraPageSource } from '../labelCameras'
import { defaultLabelPaper } from '../paperDefault'

const row = (i: number): FleetCameraRow => ({
  id: i,
  assetTag: `HBR-${String(i).padStart(4, '0')}`,
  siteId: 1,
  siteName: 'Harbour Depot',
  locationText: `Quay ${i}`,
  taskId: 'observe',
  taskName: 'Observe',
  cameraModelId: 1,
  cameraModelName: 'Dome 4MP',
  state: 'ok',
  lastCheckAt: null,
  lastVerdict: null,
  lastMtf50CyPx: null,
  minMtf50CyPx: 0.25,
  nextDueAt: null,
  overdue: false,
  active: true,
})

/** An in-memory camera list that pages like the API and records what it was asked. */
function source(count: number) {
  const rows = Array.from({ length: count }, (_, i) => row(i + 1))
  const asked: Parameters<CameraPageSource>[0][] = []
  const fetchPage: CameraPageSource = async (query) => {
    asked.push(query)
    const items = rows.slice(query.offset, query.offset + query.limit)
    return { items, total: rows.length, limit: query.limit, offset: query.offset }
  }
  return { fetchPage, asked }
}

describe('the cameras a label PDF is made for', () => {
  it('are every camera in service the search finds, fetched a page at a time', async () => {
    const { fetchPage, asked } = source(450)
    const list = await collectLabelCameras(fetchPage, 'HBR')
    expect(list.total).toBe(450)
    expect(list.cameras).toHaveLength(450)
    expect(list.cameras[449]).toEqual({
      assetTag: 'HBR-0450',
      siteName: 'Harbour Depot',
      locationText: 'Quay 450',
    })
    expect(asked.map((q) => q.offset)).toEqual([0, LABEL_FETCH_PAGE, 2 * LABEL_FETCH_PAGE])
    expect(asked.every((q) => q.q === 'HBR' && q.includeRetired === false)).toBe(true)
  })

  it('are none, with the count, when more match than one PDF holds', async () => {
    const { fetchPage, asked } = source(501)
    expect(await collectLabelCameras(fetchPage, undefined)).toEqual({ cameras: [], total: 501 })
    expect(asked).toHaveLength(1)
  })

  it('stop when the list runs out even if the total said more', async () => {
    const fetchPage: CameraPageSource = async (q) => ({
      items: q.offset === 0 ? [row(1)] : [],
      total: 3,
      limit: q.limit,
      offset: q.offset,
    })
    expect((await collectLabelCameras(fetchPage, undefined)).cameras).toHaveLength(1)
  })
})

describe('the paper offered first', () => {
  it('is US Letter where offices use it and A4 elsewhere', () => {
    expect(defaultLabelPaper('en-US')).toBe('Letter')
    expect(defaultLabelPaper('fr-CA')).toBe('Letter')
    expect(defaultLabelPaper('es-MX')).toBe('Letter')
    expect(defaultLabelPaper('en-GB')).toBe('A4')
    expect(defaultLabelPaper('de')).toBe('A4')
    expect(defaultLabelPaper('not a locale')).toBe('A4')
    expect(defaultLabelPaper(undefined)).toBe('A4')
  })
})
