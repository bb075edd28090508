// The sync API: push queued operations, pull what changed, upload a check's files.
import {
  attachmentUploadResponseSchema,
  type AttachmentUploadResponse,
} from '@shared/schemas/checks'
import {
  pullResponseSchema,
  pushResponseSchema,
  type PullResponse,
  type PushRequest,
  type PushResponse,
} from '@shared/schemas/sync'
import { http } from './http'

export function pushOperations(body: PushRequest, signal?: AbortSignal): Promise<PushResponse> {
  return http.post('/api/sync/push', body, { schema: pushResponseSchema, signal })
}

export function pullChanges(
  cursor: number,
  limit?: number,
  signal?: AbortSignal,
): Promise<PullResponse> {
  return http.get('/api/sync/pull', {
    query: { cursor, limit },
    schema: pullResponseSchema,
    signal,
  })
}

export interface UploadFields {
  kind: 'roi' | 'frame'
  measurementId: string | null
  encoding: string
}

export function uploadCheckFile(
  checkId: string,
  file: Blob,
  name: string,
  fields: UploadFields,
  signal?: AbortSignal,
): Promise<AttachmentUploadResponse> {
  const form = new FormData()
  form.set('kind', fields.kind)
  if (fields.measurementId) form.set('measurementId', fields.measurementId)
  form.set('encoding', fields.encoding)
  form.set('file', file, name)
  return http.post(`/api/checks/${encodeURIComponent(checkId)}/attachments`, form, {
    schema: attachmentUploadResponseSchema,
    signal,
  })
}

export interface SyncApi {
  push: typeof pushOperations
  pull: typeof pullChanges
  upload: typeof uploadCheckFile
}

export const syncApi: SyncApi = { push: pushOperations, pull: pullChanges, upload: uploadCheckFile }
