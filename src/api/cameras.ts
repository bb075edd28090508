// Cameras: the whole list (paged through) for the offline cache, and one camera in detail.
import {
  cameraDetailSchema,
  cameraListSchema,
  type Camera,
  type CameraDetail,
} from '@shared/schemas/cameras'
import { http } from './http'

export type { Camera, CameraDetail }

const PAGE_SIZE = 500

/** Every camera the signed-in user may see, all pages. */
export async function fetchAllCameras(signal?: AbortSignal): Promise<Camera[]> {
  const all: Camera[] = []
  for (;;) {
    const page = await http.get('/api/cameras', {
      query: { limit: PAGE_SIZE, offset: all.length, sort: 'assetTag' },
      schema: cameraListSchema,
      signal,
    })
    all.push(...page.items)
    if (page.items.length === 0 || all.length >= page.total) return all
  }
}

export function fetchCamera(id: number, signal?: AbortSignal): Promise<CameraDetail> {
  return http.get(`/api/cameras/${id}`, { schema: cameraDetailSchema, signal })
}
