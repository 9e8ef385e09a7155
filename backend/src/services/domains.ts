import { and, asc, eq } from 'drizzle-orm'
import type { z } from 'zod'
import { domains, type DomainBody } from '../../../schema/index'
import type { Db } from '../db/client'
import { notFound } from '../http/errors'
import { audit } from './audit'

type DomainInput = z.infer<typeof DomainBody>

/** The project's structural/geotechnical domains, by name. */
export const listDomains = (db: Db, projectId: number) =>
  db.select().from(domains).where(eq(domains.projectId, projectId)).orderBy(asc(domains.name))

export async function createDomain(db: Db, actorId: number, projectId: number, input: DomainInput) {
  return db.transaction(async (tx) => {
    const [d] = await tx
      .insert(domains)
      .values({ ...input, projectId })
      .returning()
    await audit(tx, {
      projectId,
      userId: actorId,
      entity: 'domain',
      entityId: d.id,
      action: 'create',
      after: d,
    })
    return d
  })
}

/** Renames or redescribes a domain of this project; another project's is not found (404). */
export async function updateDomain(
  db: Db,
  actorId: number,
  projectId: number,
  domainId: number,
  input: Partial<DomainInput>,
) {
  return db.transaction(async (tx) => {
    const where = and(eq(domains.id, domainId), eq(domains.projectId, projectId))
    const [before] = await tx.select().from(domains).where(where)
    if (!before) throw notFound('Domain')
    const [after] = await tx.update(domains).set(input).where(where).returning()
    await audit(tx, {
      projectId,
      userId: actorId,
      entity: 'domain',
      entityId: after.id,
      action: 'update',
      before,
      after,
    })
    return after
  })
}
