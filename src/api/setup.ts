// Setup (admin; supervisors may change task thresholds): users, sites, camera models, tasks,
// cameras, the camera CSV import and the audit log.
import { cameraDetailSchema, type CameraDetail } from '@shared/schemas/cameras'
import {
  cameraModelListSchema,
  cameraModelSchema,
  taskSchema,
  type CameraModel,
  type Task,
} from '@shared/schemas/catalog'
import {
  csvCommitSchema,
  csvPreviewSchema,
  type CsvCommit,
  type CsvPreview,
} from '@shared/schemas/csv'
import {
  auditPageSchema,
  type AuditPage,
  type CameraInput,
  type CameraModelInput,
  type CameraUpdate,
  type SiteInput,
  type TaskUpdate,
  type UserCreate,
  type UserUpdate,
} from '@shared/schemas/setup'
import { siteSchema, type Site } from '@shared/schemas/sites'
import { userSchema, type User } from '@shared/schemas/users'
import { authedFetch, download } from './files'
import { http, type Query } from './http'

export type { AuditPage, CameraDetail, CameraModel, CsvCommit, CsvPreview, Site, Task, User }

export const createUser = (input: UserCreate): Promise<User> =>
  http.post('/api/users', input, { schema: userSchema })
export const updateUser = (id: number, input: UserUpdate): Promise<User> =>
  http.request('PATCH', `/api/users/${id}`, { body: input, schema: userSchema })
export const resetPassword = (id: number, password: string): Promise<User> =>
  http.post(`/api/users/${id}/password`, { password }, { schema: userSchema })

export const createSite = (input: SiteInput): Promise<Site> =>
  http.post('/api/sites', input, { schema: siteSchema })
export const updateSite = (id: number, input: Partial<SiteInput>): Promise<Site> =>
  http.request('PATCH', `/api/sites/${id}`, { body: input, schema: siteSchema })

export async function fetchModels(): Promise<CameraModel[]> {
  return (await http.get('/api/camera-models', { schema: cameraModelListSchema })).items
}
export const createModel = (input: CameraModelInput): Promise<CameraModel> =>
  http.post('/api/camera-models', input, { schema: cameraModelSchema })
export const updateModel = (id: number, input: CameraModelInput): Promise<CameraModel> =>
  http.request('PUT', `/api/camera-models/${id}`, { body: input, schema: cameraModelSchema })

export const updateTask = (id: string, input: TaskUpdate): Promise<Task> =>
  http.request('PATCH', `/api/tasks/${encodeURIComponent(id)}`, { body: input, schema: taskSchema })

export const createCamera = (input: CameraInput): Promise<CameraDetail> =>
  http.post('/api/cameras', input, { schema: cameraDetailSchema })
export const updateCamera = (id: number, input: CameraUpdate): Promise<CameraDetail> =>
  http.request('PATCH', `/api/cameras/${id}`, { body: input, schema: cameraDetailSchema })
export const fetchCamera = (id: number): Promise<CameraDetail> =>
  http.get(`/api/cameras/${id}`, { schema: cameraDetailSchema })

export const fetchAudit = (query: Query): Promise<AuditPage> =>
  http.get('/api/audit-log', { query, schema: auditPageSchema })

async function sendCsv(path: string, file: File): Promise<unknown> {
  const form = new FormData()
  form.append('file', file, file.name)
  const res = await authedFetch('POST', path, { body: form })
  return res.json()
}
export const previewImport = async (file: File): Promise<CsvPreview> =>
  csvPreviewSchema.parse(await sendCsv('/api/setup/camera-import/preview', file))
export const commitImport = async (file: File): Promise<CsvCommit> =>
  csvCommitSchema.parse(await sendCsv('/api/setup/camera-import/commit', file))
export const downloadTemplate = () =>
  download('/api/setup/camera-import/template', undefined, 'sharpfield-cameras-template.csv')
