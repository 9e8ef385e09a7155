import { auditEvents } from '../../../schema/index'
import type { Executor } from '../db/client'

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
