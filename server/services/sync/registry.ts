import type { z } from 'zod'
import type { Role } from '../../../shared/schemas/enums'
import type { DbOrTx } from '../../db/client'
import type { AuthUser } from '../tokens'

/** What an operation handler knows about the push it belongs to. */
export interface OpContext {
  user: AuthUser
  deviceId: string
  opId: string
  kind: string
  now: Date
}

/** `applied`: it changed something now; `duplicate`: its effect was already there. */
export interface OpOutcome {
  status: 'applied' | 'duplicate'
  /** Stored with the operation (e.g. the id of what it created). */
  result?: Record<string, unknown>
}

/**
 * Thrown by a handler (or a check hook) when the operation cannot be applied as sent: the
 * transaction is rolled back, the device keeps the operation with this code and sentence.
 */
export class OpRejection extends Error {
  override name = 'OpRejection'
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message)
  }
}

/** One kind of operation: who may send it, its payload contract, and how it is applied. */
export interface OpDef<P = unknown> {
  kind: string
  roles: readonly Role[]
  payload: z.ZodType<P>
  /** Runs inside the operation's own transaction; throw OpRejection to refuse it. */
  apply(tx: DbOrTx, payload: P, ctx: OpContext): Promise<OpOutcome>
}

const ops = new Map<string, OpDef>()

/**
 * Adds an operation kind (`noun.verb`, e.g. `check.create`, `workOrder.action`). Registering the
 * same kind twice is a programming error. Returns a function that removes it again (tests).
 */
export function registerOp<P>(def: OpDef<P>): () => void {
  if (ops.has(def.kind)) throw new Error(`The sync operation kind ${def.kind} is registered twice.`)
  ops.set(def.kind, def as OpDef)
  return () => {
    if (ops.get(def.kind) === (def as OpDef)) ops.delete(def.kind)
  }
}

export function getOp(kind: string): OpDef | undefined {
  return ops.get(kind)
}

/** The registered kinds with their roles (docs and tests). */
export function listOps(): { kind: string; roles: readonly Role[] }[] {
  return [...ops.values()].map((d) => ({ kind: d.kind, roles: d.roles }))
}
