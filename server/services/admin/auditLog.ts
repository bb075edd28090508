// The audit log for administrators: newest first, filtered by entity or actor, paged.
import { and, count, desc, eq } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import type { AuditPage, AuditQuery } from '../../../shared/schemas/setup'
import type { Db } from '../../db/client'
import { auditLog, users } from '../../db/schema'

export async function listAudit(db: Db, q: AuditQuery): Promise<AuditPage> {
  const where: SQL[] = []
  if (q.entity) where.push(eq(auditLog.entity, q.entity))
  if (q.actorId) where.push(eq(auditLog.actorId, q.actorId))
  const cond = where.length ? and(...where) : undefined
  const rows = await db
    .select({ a: auditLog, actorName: users.name })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(cond)
    .orderBy(desc(auditLog.id))
    .limit(q.limit)
    .offset(q.offset)
  const [{ total }] = await db.select({ total: count() }).from(auditLog).where(cond)
  return {
    items: rows.map(({ a, actorName }) => ({
      id: a.id,
      at: a.at.toISOString(),
      actorId: a.actorId,
      actorName,
      action: a.action,
      entity: a.entity,
      entityId: a.entityId,
      detail: a.detail ?? null,
    })),
    total: Number(total),
    limit: q.limit,
    offset: q.offset,
  }
}
