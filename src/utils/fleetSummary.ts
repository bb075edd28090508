// Counts of cameras by urgency, overall and per site, from the camera list as it stands.
import type { Camera } from '@shared/schemas/cameras'
import { urgencyOf, type Urgency } from './cameraDue'

export type UrgencyCounts = Record<Urgency, number> & { total: number }

export interface SiteSummary {
  siteId: number
  siteName: string
  counts: UrgencyCounts
}

function emptyCounts(): UrgencyCounts {
  return { failing: 0, overdue: 0, due: 0, in_repair: 0, ok: 0, total: 0 }
}

export function summarizeFleet(
  cameras: Camera[],
  now: Date,
): { counts: UrgencyCounts; sites: SiteSummary[] } {
  const counts = emptyCounts()
  const bySite = new Map<number, SiteSummary>()
  for (const camera of cameras) {
    if (!camera.active) continue
    const u = urgencyOf(camera, now)
    counts[u]++
    counts.total++
    let site = bySite.get(camera.siteId)
    if (!site) {
      site = { siteId: camera.siteId, siteName: camera.siteName, counts: emptyCounts() }
      bySite.set(camera.siteId, site)
    }
    site.counts[u]++
    site.counts.total++
  }
  return {
    counts,
    sites: [...bySite.values()].sort((a, b) => a.siteName.localeCompare(b.siteName)),
  }
}
