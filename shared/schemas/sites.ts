import { z } from 'zod'
import { isoDateTime, listOf } from './common'

export const siteSchema = z.object({
  id: z.number().int().positive(),
  name: z.string(),
  address: z.string(),
  timeZone: z.string(),
  cameraCount: z.number().int().nonnegative(),
  updatedAt: isoDateTime,
})
export type Site = z.infer<typeof siteSchema>

export const siteListSchema = listOf(siteSchema)
export type SiteList = z.infer<typeof siteListSchema>
