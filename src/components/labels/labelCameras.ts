// The cameras a label PDF is made for: those in service matching the Setup search, fetched page
// by page (the API sends at most 200 a page), and no more than one PDF holds.
import type { FleetCameraPage } from '@shared/schemas/fleet'
import { MAX_LABELS_PER_PDF, type LabelCamera } from '@shared/target/labelSheet'

export interface LabelCameraList {
  /** The cameras to print, in asset-tag order; empty when there are too many. */
  cameras: LabelCamera[]
  /** How many cameras matched. */
  total: number
}

export type CameraPageSource = (query: {
  q?: string
  includeRetired: boolean
  sort: 'assetTag'
  limit: number
  offset: number
}) => Promise<FleetCameraPage>

/** Cameras per request: the most the camera list API sends at once. */
export const LABEL_FETCH_PAGE = 200

export async function collectLabelCameras(
  fetchPage: CameraPageSource,
  q: string | undefined,
): Promise<LabelCameraList> {
  const cameras: LabelCamera[] = []
  let total = 0
  for (let offset = 0; ; offset += LABEL_FETCH_PAGE) {
    const page = await fetchPage({
      q,
      includeRetired: false,
      sort: 'assetTag',
      limit: LABEL_FETCH_PAGE,
      offset,
    })
    total = page.total
    if (total > MAX_LABELS_PER_PDF) return { cameras: [], total }
    for (const c of page.items) {
      cameras.push({ assetTag: c.assetTag, siteName: c.siteName, locationText: c.locationText })
    }
    if (page.items.length === 0 || cameras.length >= total) return { cameras, total }
  }
}
