// Plugs work orders into sync: the check hook (failing checks open orders, re-checks close or
// return them) and the `workOrder.action` operation kind. Registered once per process;
// createApp calls it with the config whose public URL the notices link to.
import type { Config } from '../../config'
import { onCheckRecorded } from '../checkHooks'
import { registerOp } from '../sync/registry'
import { handleCheckForWorkOrders } from './checkRecorded'
import { createWorkOrderActionOp } from './syncOp'

const settings = { publicUrl: 'http://127.0.0.1:8080' }
let registered = false

export function registerWorkOrderSync(config: Pick<Config, 'publicUrl'>): void {
  settings.publicUrl = config.publicUrl
  if (registered) return
  registered = true
  onCheckRecorded(async (tx, e) => {
    await handleCheckForWorkOrders(
      tx,
      {
        id: e.check.id,
        cameraId: e.check.cameraId,
        inspectorId: e.check.inspectorId,
        verdict: e.check.verdict,
        capturedAt: e.check.capturedAt,
        reasons: e.check.reasons,
      },
      { now: e.now, publicUrl: settings.publicUrl },
    )
  })
  registerOp(createWorkOrderActionOp(settings))
}
