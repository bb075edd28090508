// Work orders for the list and the detail screens. Read from the server when online, from the
// device's last copy when not. Actions go straight to the server when it answers; with no
// connection they are queued in the sync outbox (`workOrder.action`, applied by the server on
// the next push) and shown at once on this device.
import { defineStore } from 'pinia'
import { computed, ref, watch } from 'vue'
import { z } from 'zod'
import {
  workOrderDetailSchema,
  workOrderSchema,
  type WorkOrderActionRequest,
} from '@shared/schemas/workOrders'
import { decide } from '@shared/workOrders/transitions'
import { ApiError, errorMessage } from '@/api/errors'
import {
  fetchAssignees,
  fetchWorkOrder,
  fetchWorkOrders,
  postWorkOrderAction,
  staleCurrent,
  uploadWorkOrderPhoto,
  type Assignee,
  type WorkOrder,
  type WorkOrderDetail,
  type WorkOrderFilters,
} from '@/api/workOrders'
import { db } from '@/db/database'
import { enqueue } from '@/db/outbox'
import { useAuthStore, type StoreError } from './auth'

export const WORK_ORDER_CACHE_KEY = 'sharpfield.workOrders'
export const WORK_ORDER_OP_KIND = 'workOrder.action'

const cacheSchema = z.object({
  version: z.literal(1),
  userId: z.number(),
  items: z.array(workOrderSchema),
  details: z.array(workOrderDetailSchema),
  savedAt: z.string(),
})

/** Queues the action in the sync outbox (sent with the next push, applied once by its UUID). */
async function queueOperation(payload: unknown): Promise<boolean> {
  await enqueue(WORK_ORDER_OP_KIND, payload)
  return true
}

function storage(): Storage | null {
  return typeof globalThis.localStorage === 'undefined' ? null : globalThis.localStorage
}

export type ActionOutcome = 'done' | 'queued' | 'stale' | 'failed'

export const useWorkOrdersStore = defineStore('workOrders', () => {
  const auth = useAuthStore()
  const items = ref<WorkOrder[]>([])
  const details = ref<Record<number, WorkOrderDetail>>({})
  const filters = ref<WorkOrderFilters>({ status: 'active' })
  const assignees = ref<Assignee[]>([])
  const loading = ref(false)
  const busy = ref(false)
  const error = ref<StoreError | null>(null)
  /** Actions made offline on this device, waiting for the next sync push. */
  const queued = ref(0)
  /** True while what is shown is the device's copy (no answer from the server). */
  const fromCache = ref(false)

  const overdueCount = computed(() => items.value.filter((o) => o.overdue).length)

  function fail(e: unknown): void {
    error.value = { code: e instanceof ApiError ? e.code : 'unknown', message: errorMessage(e) }
  }

  function save(): void {
    const s = storage()
    if (!s || !auth.user) return
    const record: z.infer<typeof cacheSchema> = {
      version: 1,
      userId: auth.user.id,
      items: items.value,
      details: Object.values(details.value).slice(-50),
      savedAt: new Date().toISOString(),
    }
    s.setItem(WORK_ORDER_CACHE_KEY, JSON.stringify(record))
  }

  function restore(): void {
    const raw = storage()?.getItem(WORK_ORDER_CACHE_KEY)
    if (!raw || !auth.user) return
    let parsed: ReturnType<typeof cacheSchema.safeParse>
    try {
      parsed = cacheSchema.safeParse(JSON.parse(raw))
    } catch {
      parsed = cacheSchema.safeParse(null)
    }
    if (!parsed.success || parsed.data.userId !== auth.user.id) {
      storage()?.removeItem(WORK_ORDER_CACHE_KEY)
      return
    }
    if (!items.value.length) items.value = parsed.data.items
    for (const d of parsed.data.details) details.value[d.id] ??= d
    fromCache.value = true
  }

  function remember(d: WorkOrderDetail): void {
    details.value[d.id] = d
    const { taskName: _t, history: _h, photos: _p, ...summary } = d
    const at = items.value.findIndex((o) => o.id === d.id)
    if (at >= 0) items.value[at] = summary
    save()
  }

  async function load(next?: WorkOrderFilters): Promise<void> {
    if (next) filters.value = next
    loading.value = true
    error.value = null
    try {
      items.value = (await fetchWorkOrders(filters.value)).items
      fromCache.value = false
      save()
    } catch (e) {
      if (e instanceof ApiError && e.isConnectivity) await restoreOffline()
      else fail(e)
    } finally {
      loading.value = false
    }
  }

  /** The device's copy: this store's last answer, else the orders sync pulled onto the device. */
  async function restoreOffline(): Promise<void> {
    restore()
    if (items.value.length) return
    try {
      const pulled = await db.workOrders.toArray()
      items.value = pulled.filter((o) => filters.value.status !== 'active' || !['closed', 'cancelled'].includes(o.status))
      fromCache.value = true
    } catch {
      // No IndexedDB (private mode): nothing saved to show.
    }
  }

  async function loadOne(id: number): Promise<WorkOrderDetail | null> {
    loading.value = true
    error.value = null
    try {
      const d = await fetchWorkOrder(id)
      fromCache.value = false
      remember(d)
      return d
    } catch (e) {
      if (e instanceof ApiError && e.isConnectivity) {
        restore()
        if (!details.value[id]) {
          // Pulled by sync but never opened here: show it without its history.
          const pulled = await db.workOrders.get(id).catch(() => undefined)
          if (pulled) details.value[id] = { ...pulled, taskName: '—', history: [], photos: [] }
        }
      } else fail(e)
      return details.value[id] ?? null
    } finally {
      loading.value = false
    }
  }

  async function loadAssignees(): Promise<void> {
    if (assignees.value.length) return
    try {
      assignees.value = await fetchAssignees()
    } catch (e) {
      fail(e)
    }
  }

  /** Shows an action made offline on this device until the server's answer replaces it. */
  function applyLocally(d: WorkOrderDetail, body: WorkOrderActionRequest): void {
    const me = auth.user
    if (!me) return
    const decision = decide(body.action, d, { id: me.id, role: me.role })
    if (!decision.ok) return
    const assignee = body.assigneeId ? assignees.value.find((a) => a.id === body.assigneeId) : undefined
    remember({
      ...d,
      status: decision.to,
      assigneeId: body.assigneeId ?? d.assigneeId,
      assigneeName: assignee?.name ?? d.assigneeName,
      version: d.version + 1,
      history: [
        ...d.history,
        {
          id: -Date.now(),
          at: new Date().toISOString(),
          actorId: me.id,
          actorName: `${me.name} (waiting to sync)`,
          action: body.action,
          fromStatus: d.status,
          toStatus: decision.to,
          fromAssigneeId: null,
          fromAssigneeName: null,
          toAssigneeId: body.assigneeId ?? null,
          toAssigneeName: assignee?.name ?? null,
          checkId: null,
          reason: body.reason ?? null,
          note: body.note ?? null,
          photoId: null,
        },
      ],
    })
  }

  async function act(id: number, body: Omit<WorkOrderActionRequest, 'version'>): Promise<ActionOutcome> {
    const d = details.value[id]
    if (!d) return 'failed'
    const request = { ...body, version: d.version } as WorkOrderActionRequest
    busy.value = true
    error.value = null
    try {
      remember(await postWorkOrderAction(id, request))
      return 'done'
    } catch (e) {
      if (e instanceof ApiError && e.code === 'work_order.stale') {
        const current = staleCurrent(e.details)
        if (current) remember(current)
        fail(e)
        return 'stale'
      }
      if (e instanceof ApiError && e.isConnectivity && (await queueOperation({ ...request, workOrderId: id }))) {
        queued.value++
        applyLocally(d, request)
        return 'queued'
      }
      fail(e)
      return 'failed'
    } finally {
      busy.value = false
    }
  }

  async function addPhoto(id: number, file: File, note?: string): Promise<boolean> {
    const d = details.value[id]
    if (!d) return false
    busy.value = true
    error.value = null
    try {
      remember(await uploadWorkOrderPhoto(id, file, d.version, note))
      return true
    } catch (e) {
      if (e instanceof ApiError && e.code === 'work_order.stale') {
        const current = staleCurrent(e.details)
        if (current) remember(current)
      }
      fail(e)
      return false
    } finally {
      busy.value = false
    }
  }

  function reset(): void {
    items.value = []
    details.value = {}
    assignees.value = []
    error.value = null
    queued.value = 0
  }

  watch(
    () => auth.user?.id ?? null,
    (now, before) => {
      if (now === before) return
      reset()
      if (now === null) storage()?.removeItem(WORK_ORDER_CACHE_KEY)
    },
  )

  return {
    items,
    details,
    filters,
    assignees,
    loading,
    busy,
    error,
    queued,
    fromCache,
    overdueCount,
    load,
    loadOne,
    loadAssignees,
    act,
    addPhoto,
    reset,
  }
})
