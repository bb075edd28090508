import { z } from 'zod'

/** A timestamp as the API sends it: ISO 8601 in UTC. */
export const isoDateTime = z.iso.datetime({ offset: true })

/** A positive integer id in a path, e.g. /api/cameras/:id. */
export const idParamSchema = z.object({
  id: z.coerce.number().int('must be a whole number').positive('must be positive'),
})
export type IdParam = z.infer<typeof idParamSchema>

/** A list response: `{ items: [...] }`. */
export function listOf<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item) })
}
