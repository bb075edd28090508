import type { WorkOrderStatus } from '../../../shared/schemas/enums'
import type { workOrderHistory, workOrders } from '../schema'
import { DAY_MS } from './history'
import type { DemoFailure } from './history'

// Work orders for the demo's failing and repaired cameras, each with its append-only history.

type OrderRow = Omit<typeof workOrders.$inferInsert, 'id'>
type HistoryRow = Omit<typeof workOrderHistory.$inferInsert, 'workOrderId'>

export interface DemoOrder {
  order: OrderRow
  history: HistoryRow[]
}

export interface DemoStaff {
  supervisor: number
  maintenance: number
  maintenance2: number
}

const hours = (d: Date, h: number) => new Date(d.getTime() + h * 3_600_000)

/** The story of each order, by the asset tag of its camera. Unlisted failures stay `open`. */
const STORIES: Partial<Record<string, 'assigned' | 'in_progress' | 'closed'>> = {
  'FFY-002': 'assigned',
  'ABH-002': 'in_progress',
  'MTD-003': 'closed',
}

export function buildWorkOrders(failures: readonly DemoFailure[], staff: DemoStaff): DemoOrder[] {
  return failures.map((f) => {
    const opened = hours(f.failed.capturedAt, 1)
    const story = STORIES[f.spec.assetTag] ?? 'open'
    const history: HistoryRow[] = [
      {
        actorId: null,
        at: opened,
        action: 'opened',
        toStatus: 'open',
        checkId: f.failed.id,
        note: 'Opened automatically by a failing check.',
      },
    ]
    let status: WorkOrderStatus = 'open'
    let assigneeId: number | null = null
    let closedAt: Date | null = null
    const push = (row: HistoryRow) => {
      history.push(row)
      if (row.toStatus) status = row.toStatus
      if (row.toAssigneeId !== undefined) assigneeId = row.toAssigneeId ?? null
    }
    if (story !== 'open') {
      push({
        actorId: staff.supervisor,
        at: hours(opened, 20),
        action: 'assigned',
        fromStatus: 'open',
        toStatus: 'assigned',
        toAssigneeId: staff.maintenance,
      })
    }
    if (story === 'in_progress') {
      push({
        actorId: staff.supervisor,
        at: hours(opened, 30),
        action: 'reassigned',
        fromStatus: 'assigned',
        toStatus: 'assigned',
        fromAssigneeId: staff.maintenance,
        toAssigneeId: staff.maintenance2,
        reason: 'Declan is on the Fenwick gate job this week.',
      })
      push({
        actorId: staff.maintenance2,
        at: hours(opened, 44),
        action: 'status',
        fromStatus: 'assigned',
        toStatus: 'in_progress',
        note: 'Lens ring loose after the line changeover; parts ordered.',
      })
    }
    if (story === 'closed' && f.recheck) {
      push({
        actorId: staff.maintenance,
        at: hours(opened, 48),
        action: 'status',
        fromStatus: 'assigned',
        toStatus: 'in_progress',
        note: 'On site with the lift booked.',
      })
      push({
        actorId: staff.maintenance,
        at: hours(opened, 100),
        action: 'recheck_requested',
        fromStatus: 'in_progress',
        toStatus: 'awaiting_recheck',
        note: 'Refocused with the iris open and cleaned the dome. Please re-check.',
      })
      push({
        actorId: f.recheck.inspectorId,
        at: hours(f.recheck.capturedAt, 0.2),
        action: 'closed',
        fromStatus: 'awaiting_recheck',
        toStatus: 'closed',
        checkId: f.recheck.id,
        note: 'Closed by a passing re-check.',
      })
      closedAt = hours(f.recheck.capturedAt, 0.2)
    }
    const last = history[history.length - 1].at as Date
    return {
      order: {
        cameraId: f.cameraId,
        openedByCheckId: f.failed.id,
        closedByCheckId: story === 'closed' ? (f.recheck?.id ?? null) : null,
        priority: f.task.workOrderPriority,
        assigneeId,
        dueAt: new Date(opened.getTime() + f.task.workOrderDueDays * DAY_MS),
        status,
        title: `Soft image on ${f.spec.assetTag} (${f.spec.location})`,
        description: f.failed.reasons.map((r) => r.text).join(' '),
        createdBy: null,
        closedAt,
        createdAt: opened,
        updatedAt: last,
      },
      history,
    }
  })
}
