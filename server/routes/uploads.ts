import type { Request, Response } from 'express'
import multer from 'multer'
import { z } from 'zod'
import { attachmentUploadFieldsSchema } from '../../shared/schemas/checks'
import { AppError } from '../errors'
import { UPLOAD_ERRORS } from '../services/attachments/image'
import { defineRoute, userOf } from './define'

const checkIdParams = z.object({ id: z.uuid('must be a check id (UUID)') })
const attachmentIdParams = z.object({ id: z.uuid('must be an attachment id (UUID)') })

/** Runs multer (memory storage, one file in the field `file`) and maps its errors to 4xx. */
function readMultipart(req: Request, res: Response, maxBytes: number): Promise<void> {
  if (!req.is('multipart/form-data')) {
    throw new AppError(
      UPLOAD_ERRORS.noFile,
      'Send the image as multipart/form-data with the file in the field "file".',
      415,
    )
  }
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 10, fieldSize: 2048, parts: 12 },
  }).single('file')
  return new Promise((resolve, reject) => {
    parse(req, res, (err: unknown) => {
      if (!err) return resolve()
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          const mb = Math.round(maxBytes / 1024 / 1024)
          return reject(
            new AppError(UPLOAD_ERRORS.tooLarge, `The file is larger than ${mb} MB.`, 413),
          )
        }
        return reject(
          new AppError(
            UPLOAD_ERRORS.badField,
            `The upload is not in the expected form (${err.message}).`,
            400,
          ),
        )
      }
      reject(
        new AppError(UPLOAD_ERRORS.badField, 'The multipart body is malformed or cut short.', 400),
      )
    })
  })
}

export const uploadRoutes = [
  defineRoute({
    method: 'post',
    path: '/api/checks/:id/attachments',
    access: ['inspector', 'supervisor'],
    summary:
      'Upload a region crop (or the shared full frame) of a synced check; re-measured on the server.',
    params: checkIdParams,
    async handler(ctx) {
      const { services, req, res } = ctx
      await readMultipart(req, res, services.attachments.maxBytes)
      const fields = attachmentUploadFieldsSchema.parse(req.body ?? {})
      const file = req.file
        ? new Uint8Array(req.file.buffer.buffer, req.file.buffer.byteOffset, req.file.size)
        : undefined
      const answer = await services.attachments.upload(userOf(ctx), ctx.params.id, fields, file)
      res.status(answer.status).json(answer.body)
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/checks/:id/attachments',
    access: ['inspector', 'supervisor', 'admin'],
    summary: 'The uploaded files of a check.',
    params: checkIdParams,
    async handler(ctx) {
      return { items: await ctx.services.attachments.list(userOf(ctx), ctx.params.id) }
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/attachments/:id/content',
    access: ['inspector', 'supervisor', 'admin'],
    summary:
      'The bytes of one uploaded check image (a region crop or the shared frame): its inspector, supervisors and admins.',
    params: attachmentIdParams,
    async handler(ctx) {
      const { mime, bytes } = await ctx.services.attachments.content(userOf(ctx), ctx.params.id)
      // Only the signed-in user's browser may keep it, and it asks again each time (a 304 when
      // unchanged), so a withdrawn role or a purged frame is never served from a cache.
      ctx.res.setHeader('Cache-Control', 'private, no-cache')
      ctx.res.setHeader('Content-Disposition', 'inline')
      ctx.res.type(mime).send(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength))
    },
  }),
]
