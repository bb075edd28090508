// The files uploaded with a synced check (region crops, a shared frame): the list, and one
// file's bytes. Readable by the check's inspector, supervisors and admins.
import { z } from 'zod'
import { attachmentSchema, type Attachment } from '@shared/schemas/checks'
import { http } from './http'

export type { Attachment }

const attachmentListSchema = z.object({ items: z.array(attachmentSchema) })

export async function fetchCheckAttachments(
  checkId: string,
  signal?: AbortSignal,
): Promise<Attachment[]> {
  const path = `/api/checks/${encodeURIComponent(checkId)}/attachments`
  return (await http.get(path, { schema: attachmentListSchema, signal })).items
}

/** The stored bytes of one uploaded file (PNG or JPEG, as stored). */
export function fetchAttachmentContent(id: string, signal?: AbortSignal): Promise<Blob> {
  return http.get(`/api/attachments/${encodeURIComponent(id)}/content`, {
    responseType: 'blob',
    signal,
  })
}
