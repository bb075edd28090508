import multer from 'multer'
import type { Request, Response } from 'express'
import { z } from 'zod'
import { idParamSchema } from '../../shared/schemas/common'
import { CSV_IMPORT_ERRORS, CSV_IMPORT_LIMITS } from '../../shared/schemas/csv'
import {
  auditQuerySchema,
  cameraInputSchema,
  cameraModelInputSchema,
  cameraUpdateSchema,
  passwordResetSchema,
  siteInputSchema,
  siteUpdateSchema,
  taskUpdateSchema,
  userCreateSchema,
  userUpdateSchema,
} from '../../shared/schemas/setup'
import { AppError } from '../errors'
import { cameraCsvTemplate } from '../services/admin/csvParse'
import type { UploadedCsv } from '../services/admin/cameraImport'
import { defineRoute, userOf } from './define'

// Setup: users, sites, camera models, cameras and the camera CSV import are the admin's; task
// thresholds may be changed by supervisors too. Every change is written to the audit log.

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: CSV_IMPORT_LIMITS.maxBytes, files: 1, fields: 2 },
}).single('file')

function receiveCsv(req: Request, res: Response): Promise<UploadedCsv> {
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return reject(
            new AppError(
              CSV_IMPORT_ERRORS.tooLarge,
              `The file is larger than ${CSV_IMPORT_LIMITS.maxBytes / 1024 / 1024} MB; split it into smaller files.`,
              413,
            ),
          )
        return reject(
          new AppError(
            CSV_IMPORT_ERRORS.badFile,
            `The upload was not accepted: ${err.message}.`,
            400,
          ),
        )
      }
      if (err) return reject(err as Error)
      const file = req.file
      if (!file)
        return reject(
          new AppError(
            CSV_IMPORT_ERRORS.badFile,
            'Attach the CSV file as the form field "file".',
            400,
          ),
        )
      const name = file.originalname || 'cameras.csv'
      if (!/\.(csv|txt)$/i.test(name) && !/csv|text\/plain/.test(file.mimetype))
        return reject(new AppError(CSV_IMPORT_ERRORS.badFile, `"${name}" is not a CSV file.`, 400))
      resolve({ bytes: new Uint8Array(file.buffer), fileName: name })
    })
  })
}

const taskIdParamSchema = z.object({ id: z.string().trim().min(1).max(32) })

export const setupRoutes = [
  // Users
  defineRoute({
    method: 'post',
    path: '/api/users',
    access: ['admin'],
    summary: 'Create a user with a role and a first password.',
    body: userCreateSchema,
    status: 201,
    handler: (ctx) => ctx.services.admin.users.create(userOf(ctx), ctx.body),
  }),
  defineRoute({
    method: 'patch',
    path: '/api/users/:id',
    access: ['admin'],
    summary: "Change a user's name or role, or switch the account off or on (ends their sessions).",
    params: idParamSchema,
    body: userUpdateSchema,
    handler: (ctx) => ctx.services.admin.users.update(userOf(ctx), ctx.params.id, ctx.body),
  }),
  defineRoute({
    method: 'post',
    path: '/api/users/:id/password',
    access: ['admin'],
    summary: "Set a new password for a user (ends the user's sessions).",
    params: idParamSchema,
    body: passwordResetSchema,
    handler: (ctx) => ctx.services.admin.users.resetPassword(userOf(ctx), ctx.params.id, ctx.body),
  }),
  // Sites and camera models
  defineRoute({
    method: 'post',
    path: '/api/sites',
    access: ['admin'],
    summary: 'Add a site.',
    body: siteInputSchema,
    status: 201,
    handler: (ctx) => ctx.services.admin.catalog.createSite(userOf(ctx), ctx.body),
  }),
  defineRoute({
    method: 'patch',
    path: '/api/sites/:id',
    access: ['admin'],
    summary: "Change a site's name, address or time zone.",
    params: idParamSchema,
    body: siteUpdateSchema,
    handler: (ctx) => ctx.services.admin.catalog.updateSite(userOf(ctx), ctx.params.id, ctx.body),
  }),
  defineRoute({
    method: 'post',
    path: '/api/camera-models',
    access: ['admin'],
    summary: 'Add a camera model (sensor, pixel pitch, lens).',
    body: cameraModelInputSchema,
    status: 201,
    handler: (ctx) => ctx.services.admin.catalog.createModel(userOf(ctx), ctx.body),
  }),
  defineRoute({
    method: 'put',
    path: '/api/camera-models/:id',
    access: ['admin'],
    summary: 'Replace a camera model’s details.',
    params: idParamSchema,
    body: cameraModelInputSchema,
    handler: (ctx) => ctx.services.admin.catalog.updateModel(userOf(ctx), ctx.params.id, ctx.body),
  }),
  // Tasks: thresholds (supervisors too)
  defineRoute({
    method: 'patch',
    path: '/api/tasks/:id',
    access: ['admin', 'supervisor'],
    summary: "Change a task's thresholds and follow-up settings (optimistic: send the version).",
    params: taskIdParamSchema,
    body: taskUpdateSchema,
    handler: (ctx) => ctx.services.admin.catalog.updateTask(userOf(ctx), ctx.params.id, ctx.body),
  }),
  // Cameras
  defineRoute({
    method: 'post',
    path: '/api/cameras',
    access: ['admin'],
    summary: 'Add a camera to the inventory.',
    body: cameraInputSchema,
    status: 201,
    async handler(ctx) {
      const id = await ctx.services.admin.cameras.create(userOf(ctx), ctx.body)
      return ctx.services.cameras.get(id)
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/api/cameras/:id',
    access: ['admin'],
    summary: 'Change a camera (including retiring it with active: false).',
    params: idParamSchema,
    body: cameraUpdateSchema,
    async handler(ctx) {
      await ctx.services.admin.cameras.update(userOf(ctx), ctx.params.id, ctx.body)
      return ctx.services.cameras.get(ctx.params.id)
    },
  }),
  // Camera CSV import
  defineRoute({
    method: 'get',
    path: '/api/setup/camera-import/template',
    access: ['admin'],
    summary: 'The camera inventory CSV template.',
    handler({ res }) {
      res.setHeader('Content-Type', 'text/csv; charset=utf-8')
      res.setHeader('Content-Disposition', 'attachment; filename="sharpfield-cameras-template.csv"')
      res.status(200).end(cameraCsvTemplate())
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/setup/camera-import/preview',
    access: ['admin'],
    summary:
      'Check a camera CSV (multipart field "file", at most 2 MB and 10 000 rows): every row with its errors; nothing is written.',
    async handler({ services, req, res }) {
      return services.admin.cameraImport.preview(await receiveCsv(req, res))
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/setup/camera-import/commit',
    access: ['admin'],
    summary:
      'Import a camera CSV in one transaction: checked again, and nothing imported when any row is wrong (422).',
    status: 201,
    async handler(ctx) {
      return ctx.services.admin.cameraImport.commit(userOf(ctx), await receiveCsv(ctx.req, ctx.res))
    },
  }),
  // Audit log
  defineRoute({
    method: 'get',
    path: '/api/audit-log',
    access: ['admin'],
    summary: 'The audit log, newest first (filter by entity or actor), paged.',
    query: auditQuerySchema,
    handler: ({ services, query }) => services.admin.audit(query),
  }),
]
