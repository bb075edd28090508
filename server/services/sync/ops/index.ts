// The operation kinds the server accepts through POST /api/sync/push. Add a kind by writing
// `ops/<kind>.ts` (an OpDef: roles, zod payload from shared/schemas, apply(tx, payload, ctx))
// and listing it here.
import { registerOp } from '../registry'
import { checkCreateOp } from './checkCreate'
import { checkMarkBaselineOp } from './checkMarkBaseline'

let registered = false

/** Registers the built-in kinds once (idempotent; createApp calls it). */
export function registerBuiltInOps(): void {
  if (registered) return
  registered = true
  registerOp(checkCreateOp)
  registerOp(checkMarkBaselineOp)
}
