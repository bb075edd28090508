import { z } from 'zod'
import { isoDateTime, listOf } from './common'
import { roleSchema } from './enums'

export const userSchema = z.object({
  id: z.number().int().positive(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  active: z.boolean(),
  createdAt: isoDateTime,
  updatedAt: isoDateTime,
})
export type User = z.infer<typeof userSchema>

export const userListSchema = listOf(userSchema)
export type UserList = z.infer<typeof userListSchema>
