import { checkCreatePayloadSchema } from '../../../../shared/schemas/checks'
import type { CheckCreatePayload } from '../../../../shared/schemas/checks'
import { recordCheck } from '../../checks'
import type { OpDef } from '../registry'

/** A check made on a device: the check, its measurements and its verdict. */
export const checkCreateOp: OpDef<CheckCreatePayload> = {
  kind: 'check.create',
  roles: ['inspector', 'supervisor'],
  payload: checkCreatePayloadSchema,
  apply: recordCheck,
}
