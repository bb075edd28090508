// A camera's checks on the server (with its baseline) and the camera models (lens data).
import { cameraChecksSchema, type CameraChecks } from '@shared/schemas/cameraChecks'
import { cameraModelListSchema, type CameraModel } from '@shared/schemas/catalog'
import { http } from './http'

export type { CameraChecks, CameraModel }

export function fetchCameraChecks(
  cameraId: number,
  limit = 100,
  signal?: AbortSignal,
): Promise<CameraChecks> {
  return http.get(`/api/cameras/${cameraId}/checks`, {
    query: { limit },
    schema: cameraChecksSchema,
    signal,
  })
}

export async function fetchCameraModels(signal?: AbortSignal): Promise<CameraModel[]> {
  return (await http.get('/api/camera-models', { schema: cameraModelListSchema, signal })).items
}
