// The sync operation kind `workOrder.action`: a work-order action made on a phone, possibly
// offline, pushed later with the client's operation UUID (the sync layer stores the outcome, so a
// replay is a no-op). It runs inside the operation's transaction. An older `version` is accepted
// when the transition table still allows the action on the order as it is now (e.g. a note
// written offline while a supervisor added another); a real conflict (reassigned away,
// cancelled, already moved on) is refused with a reason.
import { workOrderSyncPayloadSchema } from '../../../shared/schemas/workOrders'
import type { WorkOrderSyncPayload } from '../../../shared/schemas/workOrders'
import { AppError } from '../../errors'
import { OpRejection } from '../sync/registry'
import type { OpDef } from '../sync/registry'
import { applyAction } from './actions'

export const WORK_ORDER_OP_KIND = 'workOrder.action'

export function createWorkOrderActionOp(settings: { publicUrl: string }): OpDef<WorkOrderSyncPayload> {
  return {
    kind: WORK_ORDER_OP_KIND,
    roles: ['supervisor', 'maintenance'],
    payload: workOrderSyncPayloadSchema,
    async apply(tx, p, ctx) {
      try {
        const version = await applyAction(
          { tx, actor: ctx.user, now: ctx.now, publicUrl: settings.publicUrl, versions: 'merge' },
          p.workOrderId,
          { action: p.action, version: p.version, assigneeId: p.assigneeId, reason: p.reason, note: p.note },
        )
        return { status: 'applied', result: { workOrderId: p.workOrderId, version } }
      } catch (err) {
        // The service's refusals (not yours, wrong status, unknown order) become the operation's.
        if (err instanceof AppError && err.status < 500) throw new OpRejection(err.code, err.message)
        throw err
      }
    },
  }
}
