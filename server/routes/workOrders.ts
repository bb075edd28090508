import multer from 'multer'
import type { Request, Response } from 'express'
import { z } from 'zod'
import { idParamSchema } from '../../shared/schemas/common'
import { ROLES } from '../../shared/schemas/enums'
import {
  WORK_ORDER_ERRORS,
  workOrderActionRequestSchema,
  workOrderCreateSchema,
  workOrderListQuerySchema,
} from '../../shared/schemas/workOrders'
import { AppError } from '../errors'
import { MAX_PHOTO_BYTES } from '../services/workOrders/photos'
import { defineRoute, userOf } from './define'

// Work orders. Everyone signed in may read them (maintenance only its own); supervisors open,
// assign, reassign and cancel; maintenance works its own orders. Who may take which action on
// which order is the transition table's call (shared/workOrders/transitions.ts).

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 5, fieldSize: 8_000 },
}).single('photo')

function receivePhoto(req: Request, res: Response): Promise<void> {
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (!err) return resolve()
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return reject(
            new AppError(
              WORK_ORDER_ERRORS.badPhoto,
              `The photo is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB.`,
              413,
            ),
          )
        return reject(
          new AppError(WORK_ORDER_ERRORS.badPhoto, `The upload was not accepted: ${err.message}.`, 400),
        )
      }
      reject(err as Error)
    })
  })
}

const photoFieldsSchema = z.object({
  version: z.coerce.number().int().positive(),
  note: z.string().trim().min(1).max(4000).optional(),
})

const photoParamsSchema = idParamSchema.extend({ photoId: z.uuid() })

export const workOrderRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/work-orders',
    access: ROLES,
    summary: 'Work orders with filters (status, assignee, site, camera, overdue); maintenance sees only its own.',
    query: workOrderListQuerySchema,
    handler: (ctx) => ctx.services.workOrders.list(userOf(ctx), ctx.query),
  }),
  defineRoute({
    method: 'post',
    path: '/api/work-orders',
    access: ['supervisor'],
    summary: 'Open a work order by hand for a camera without an open one (priority and due date from its task).',
    body: workOrderCreateSchema,
    status: 201,
    handler: (ctx) => ctx.services.workOrders.create(userOf(ctx), ctx.body),
  }),
  defineRoute({
    method: 'get',
    path: '/api/work-orders/:id',
    access: ROLES,
    summary: 'One work order with its history and photos.',
    params: idParamSchema,
    handler: (ctx) => ctx.services.workOrders.get(userOf(ctx), ctx.params.id),
  }),
  defineRoute({
    method: 'post',
    path: '/api/work-orders/:id/actions',
    access: ['supervisor', 'maintenance'],
    summary:
      'Assign, reassign, start, ask for a re-check, add a note or cancel, with the version seen (409 when stale).',
    params: idParamSchema,
    body: workOrderActionRequestSchema,
    handler: (ctx) => ctx.services.workOrders.act(userOf(ctx), ctx.params.id, ctx.body),
  }),
  defineRoute({
    method: 'post',
    path: '/api/work-orders/:id/photos',
    access: ['supervisor', 'maintenance'],
    summary: 'Attach a PNG or JPEG photo (multipart field `photo`, with `version` and an optional `note`).',
    params: idParamSchema,
    status: 201,
    async handler(ctx) {
      await receivePhoto(ctx.req, ctx.res)
      const fields = photoFieldsSchema.parse(ctx.req.body ?? {})
      const file = ctx.req.file
      if (!file)
        throw new AppError(
          WORK_ORDER_ERRORS.badPhoto,
          'Attach the photo as the multipart field "photo".',
          400,
        )
      return ctx.services.workOrders.addPhoto(userOf(ctx), ctx.params.id, {
        bytes: file.buffer,
        version: fields.version,
        note: fields.note,
      })
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/work-orders/:id/photos/:photoId',
    access: ROLES,
    summary: 'The bytes of a photo on a work order.',
    params: photoParamsSchema,
    async handler(ctx) {
      const photo = await ctx.services.workOrders.photo(userOf(ctx), ctx.params.id, ctx.params.photoId)
      ctx.res.setHeader('Content-Type', photo.mime)
      ctx.res.setHeader('Content-Disposition', 'inline')
      ctx.res.status(200).end(photo.bytes)
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/assignees',
    access: ['supervisor'],
    summary: 'Active maintenance users a work order can be assigned to.',
    async handler({ services }) {
      return { items: await services.workOrders.assignees() }
    },
  }),
]
