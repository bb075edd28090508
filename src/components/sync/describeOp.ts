// Plain words for a queued operation on the Sync screen.
import type { OutboxRecord } from '@/db/outbox'
import { formatDateTime } from '@/utils/format'

export interface OpDescription {
  title: string
  detail: string
}

const VERDICT_WORD: Record<string, string> = { pass: 'pass', marginal: 'marginal', fail: 'fail' }

/** `cameraName(id)` gives an asset tag when the device knows the camera. */
export function describeOp(
  op: Pick<OutboxRecord, 'kind' | 'payload' | 'createdAt'>,
  cameraName: (id: number) => string | null,
): OpDescription {
  const p = (op.payload ?? {}) as Record<string, unknown>
  const camera =
    typeof p.cameraId === 'number' ? (cameraName(p.cameraId) ?? `camera ${p.cameraId}`) : null
  const queued = `queued ${formatDateTime(op.createdAt)}`
  switch (op.kind) {
    case 'check.create': {
      const verdict = typeof p.verdict === 'string' ? VERDICT_WORD[p.verdict] : undefined
      const mode = p.mode === 'night' ? 'night check' : 'check'
      return {
        title: `${camera ? `${camera}: ` : ''}${mode}${verdict ? ` (${verdict})` : ''}`,
        detail: `Captured ${formatDateTime(typeof p.capturedAt === 'string' ? p.capturedAt : null)}, ${queued}`,
      }
    }
    case 'check.markBaseline':
      return { title: `${camera ? `${camera}: ` : ''}set as baseline`, detail: queued }
    case 'workOrder.action': {
      const action = typeof p.action === 'string' ? p.action.replace(/_/g, ' ') : 'update'
      const order = typeof p.workOrderId === 'number' ? `Work order ${p.workOrderId}` : 'Work order'
      return { title: `${order}: ${action}`, detail: queued }
    }
    default:
      return { title: op.kind, detail: queued }
  }
}
