// Filter, sort and group cameras by site for the camera lists.
import type { Camera } from '@shared/schemas/cameras'
import { compareUrgency, needsCheck } from './cameraDue'

export interface SiteGroup {
  siteId: number
  siteName: string
  cameras: Camera[]
}

/** Case-insensitive match on asset tag, location, site, task or model name. */
export function matchesSearch(camera: Camera, query: string): boolean {
  const q = query.trim().toLowerCase()
  if (!q) return true
  return [
    camera.assetTag,
    camera.locationText,
    camera.siteName,
    camera.taskName,
    camera.cameraModelName,
  ].some((field) => field.toLowerCase().includes(q))
}

export interface GroupOptions {
  query: string
  onlyNeedingCheck: boolean
  now: Date
}

/** Sites in name order; inside each, the most urgent camera first. Empty sites are left out. */
export function groupCamerasBySite(cameras: Camera[], options: GroupOptions): SiteGroup[] {
  const groups = new Map<number, SiteGroup>()
  for (const camera of cameras) {
    if (!camera.active) continue
    if (options.onlyNeedingCheck && !needsCheck(camera, options.now)) continue
    if (!matchesSearch(camera, options.query)) continue
    let group = groups.get(camera.siteId)
    if (!group) {
      group = { siteId: camera.siteId, siteName: camera.siteName, cameras: [] }
      groups.set(camera.siteId, group)
    }
    group.cameras.push(camera)
  }
  const list = [...groups.values()].sort((a, b) => a.siteName.localeCompare(b.siteName))
  for (const group of list) group.cameras.sort((a, b) => compareUrgency(a, b, options.now))
  return list
}
