import { describe, expect, it } from 'vitest'
import { sampleCamera } from '@/db/__tests__/sampleCatalog'
import { groupCamerasBySite } from '../cameraGroups'

const NOW = new Date('2025-06-10T12:00:00.000Z')
const future = '2025-09-01T00:00:00.000Z'

const cameras = [
  sampleCamera(1, { siteId: 2, siteName: 'Yard', assetTag: 'Y-1', state: 'ok', nextDueAt: future }),
  sampleCamera(2, {
    siteId: 1,
    siteName: 'Depot',
    assetTag: 'D-2',
    state: 'ok',
    nextDueAt: future,
    locationText: 'Bus bay 4',
  }),
  sampleCamera(3, { siteId: 1, siteName: 'Depot', assetTag: 'D-3', state: 'failing' }),
  sampleCamera(4, {
    siteId: 2,
    siteName: 'Yard',
    assetTag: 'Y-4',
    state: 'due',
    nextDueAt: future,
    active: false,
  }),
]

describe('grouping cameras by site', () => {
  it('lists sites by name with the most urgent camera first and leaves out inactive cameras', () => {
    const groups = groupCamerasBySite(cameras, { query: '', onlyNeedingCheck: false, now: NOW })
    expect(groups.map((g) => [g.siteName, g.cameras.map((c) => c.assetTag)])).toEqual([
      ['Depot', ['D-3', 'D-2']],
      ['Yard', ['Y-1']],
    ])
  })

  it('"needs a check" keeps only failing, overdue and due cameras and drops empty sites', () => {
    const groups = groupCamerasBySite(cameras, { query: '', onlyNeedingCheck: true, now: NOW })
    expect(groups.map((g) => [g.siteName, g.cameras.map((c) => c.assetTag)])).toEqual([
      ['Depot', ['D-3']],
    ])
  })

  it('search matches location text regardless of case', () => {
    const groups = groupCamerasBySite(cameras, {
      query: 'BUS bay',
      onlyNeedingCheck: false,
      now: NOW,
    })
    expect(groups.flatMap((g) => g.cameras.map((c) => c.assetTag))).toEqual(['D-2'])
  })
})
