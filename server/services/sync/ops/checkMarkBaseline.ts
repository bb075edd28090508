import { markBaselinePayloadSchema } from '../../../../shared/schemas/checks'
import type { MarkBaselinePayload } from '../../../../shared/schemas/checks'
import { markBaseline } from '../../checksBaseline'
import type { OpDef } from '../registry'

/** Make a synced check its camera's baseline (supervisor; inspector at commissioning). */
export const checkMarkBaselineOp: OpDef<MarkBaselinePayload> = {
  kind: 'check.markBaseline',
  roles: ['inspector', 'supervisor'],
  payload: markBaselinePayloadSchema,
  apply: markBaseline,
}
