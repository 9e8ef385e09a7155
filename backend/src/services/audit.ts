import { and, desc, eq, gte, lt, lte } from 'drizzle-orm'
import type { z } from 'zod'
import { auditEvents, users, type AuditQuery } from '../../../schema/index'
import type { Db, Executor } from '../db/client'

export interface AuditEntry {
  projectId: number | null
  userId: number | null
  entity: string
  entityId: string | number
  action: 'create' | 'update' | 'delete' | 'replace' | 'recompute' | 'import' | string
  before?: unknown
  after?: unknown
}

/** Records one write; call it inside the same transaction as the write itself. */
export async function audit(tx: Executor, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({
    projectId: entry.projectId,
    userId: entry.userId,
    entity: entry.entity,
    entityId: String(entry.entityId),
    action: entry.action,
    before: entry.before ?? null,
    after: entry.after ?? null,
  })
}

/** Drops secrets before a row goes into the audit log. */
export function withoutSecrets<T extends Record<string, unknown>>(row: T): Omit<T, 'passwordHash'> {
  const { passwordHash: _omit, ...rest } = row
  return rest
}

/**
 * The project's audit trail, newest first, with before/after and the user's name; filtered by
 * entity, action, user and time, paged with `before` (an event id). `next` is the id to page on.
 */
export async function listAudit(db: Db, projectId: number, q: z.infer<typeof AuditQuery>) {
  const rows = await db
    .select({
      id: auditEvents.id,
      at: auditEvents.at,
      entity: auditEvents.entity,
      entityId: auditEvents.entityId,
      action: auditEvents.action,
      before: auditEvents.before,
      after: auditEvents.after,
      userId: auditEvents.userId,
      userName: users.name,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.userId))
    .where(
      and(
        eq(auditEvents.projectId, projectId),
        q.entity ? eq(auditEvents.entity, q.entity) : undefined,
        q.action ? eq(auditEvents.action, q.action) : undefined,
        q.userId ? eq(auditEvents.userId, q.userId) : undefined,
        q.from ? gte(auditEvents.at, new Date(q.from)) : undefined,
        q.to ? lte(auditEvents.at, new Date(q.to)) : undefined,
        q.before ? lt(auditEvents.id, q.before) : undefined,
      ),
    )
    .orderBy(desc(auditEvents.id))
    .limit(q.limit)
  return { rows, next: rows.length === q.limit ? rows[rows.length - 1].id : null }
}
