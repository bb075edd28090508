// Work orders: list, detail, open by hand, actions (with the version seen), photos, assignees.
import {
  assigneeListSchema,
  staleDetailsSchema,
  workOrderDetailSchema,
  workOrderListSchema,
  type Assignee,
  type WorkOrder,
  type WorkOrderActionRequest,
  type WorkOrderCreate,
  type WorkOrderDetail,
  type WorkOrderList,
} from '@shared/schemas/workOrders'
import { http, type Query } from './http'

export type { Assignee, WorkOrder, WorkOrderDetail, WorkOrderList }

export interface WorkOrderFilters {
  status?: WorkOrder['status'] | 'active'
  assigneeId?: number
  siteId?: number
  overdue?: boolean
}

export function fetchWorkOrders(filters: WorkOrderFilters = {}, signal?: AbortSignal): Promise<WorkOrderList> {
  const query: Query = { ...filters, limit: 500 }
  return http.get('/api/work-orders', { query, schema: workOrderListSchema, signal })
}

export function fetchWorkOrder(id: number, signal?: AbortSignal): Promise<WorkOrderDetail> {
  return http.get(`/api/work-orders/${id}`, { schema: workOrderDetailSchema, signal })
}

export function createWorkOrder(body: WorkOrderCreate): Promise<WorkOrderDetail> {
  return http.post('/api/work-orders', body, { schema: workOrderDetailSchema })
}

export function postWorkOrderAction(id: number, body: WorkOrderActionRequest): Promise<WorkOrderDetail> {
  return http.post(`/api/work-orders/${id}/actions`, body, { schema: workOrderDetailSchema })
}

export function uploadWorkOrderPhoto(id: number, file: Blob, version: number, note?: string): Promise<WorkOrderDetail> {
  const form = new FormData()
  form.set('version', String(version))
  if (note) form.set('note', note)
  form.set('photo', file, file instanceof File ? file.name : 'photo')
  return http.post(`/api/work-orders/${id}/photos`, form, { schema: workOrderDetailSchema })
}

export function fetchWorkOrderPhoto(id: number, photoId: string, signal?: AbortSignal): Promise<Blob> {
  return http.get(`/api/work-orders/${id}/photos/${photoId}`, { responseType: 'blob', signal })
}

export async function fetchAssignees(signal?: AbortSignal): Promise<Assignee[]> {
  return (await http.get('/api/assignees', { schema: assigneeListSchema, signal })).items
}

/** The current order carried by a 409 `work_order.stale`, if the body holds one. */
export function staleCurrent(details: unknown): WorkOrderDetail | null {
  const parsed = staleDetailsSchema.safeParse(details)
  return parsed.success ? parsed.data.current : null
}
