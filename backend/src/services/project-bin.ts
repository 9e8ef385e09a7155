import { and, asc, eq, isNotNull, sql } from 'drizzle-orm'
import { memberships, projects, users, type Project } from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { ApiError, conflict, forbidden, notFound } from '../http/errors'
import { audit } from './audit'
import { RESTORE_DAYS } from './hole-bin'

/** What goes with a project (counted into the audit rows of its deletion, restore and purge). */
async function contents(db: Executor, projectId: number) {
  const { rows } = await db.execute<Record<string, number>>(sql`select
      (select count(*)::int from holes where project_id = ${projectId}) as holes,
      (select count(*)::int from structures s join holes h on h.id = s.hole_id
        where h.project_id = ${projectId}) as structures,
      (select count(*)::int from intervals i join holes h on h.id = i.hole_id
        where h.project_id = ${projectId}) as intervals,
      (select count(*)::int from intervals i join holes h on h.id = i.hole_id
        where h.project_id = ${projectId} and i.status = 'issued') as "issuedIntervals",
      (select count(*)::int from packs where project_id = ${projectId}) as packs,
      (select count(*)::int from memberships where project_id = ${projectId}) as members`)
  return rows[0]
}

/** An administrator deletes a project: it disappears for everyone at once, its data stays. */
export async function deleteProject(db: Db, actorId: number, project: Project) {
  await db.transaction(async (tx) => {
    const [after] = await tx
      .update(projects)
      .set({ deletedAt: new Date(), deletedBy: actorId, version: sql`${projects.version} + 1` })
      .where(eq(projects.id, project.id))
      .returning()
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'project',
      entityId: project.id,
      action: 'delete',
      before: project,
      after: {
        deletedAt: after.deletedAt,
        restorableForDays: RESTORE_DAYS,
        ...(await contents(tx, project.id)),
      },
    })
  })
}

const restoreUntil = (deletedAt: Date) => new Date(deletedAt.getTime() + RESTORE_DAYS * 86_400_000)

/** Deleted projects the caller may restore: all for an administrator, else those they lead. */
export async function listDeletedProjects(db: Executor, user: Express.User) {
  const rows = await db
    .select({ project: projects, deletedByName: users.name })
    .from(projects)
    .leftJoin(users, eq(users.id, projects.deletedBy))
    .where(isNotNull(projects.deletedAt))
    .orderBy(asc(projects.code))
  const out = []
  for (const { project, deletedByName } of rows) {
    if (!user.isAdmin && !(await leads(db, user.id, project.id))) continue
    out.push({
      id: project.id,
      code: project.code,
      name: project.name,
      deletedAt: project.deletedAt!,
      deletedBy: deletedByName,
      restorableUntil: restoreUntil(project.deletedAt!),
      ...(await contents(db, project.id)),
    })
  }
  return out
}

async function leads(db: Executor, userId: number, projectId: number) {
  const [m] = await db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.projectId, projectId), eq(memberships.userId, userId)))
  return m?.role === 'lead'
}

/** A deleted project the caller may act on; anyone else gets 404, as for any unseen project. */
async function deletedProject(tx: Executor, user: Express.User, projectId: number) {
  const [project] = await tx
    .select()
    .from(projects)
    .where(and(eq(projects.id, projectId), isNotNull(projects.deletedAt)))
    .for('update')
  if (!project || (!user.isAdmin && !(await leads(tx, user.id, projectId))))
    throw notFound('Deleted project')
  return project
}

/** Brings a deleted project back within RESTORE_DAYS (410 after); its lead or an administrator. */
export async function restoreProject(db: Db, user: Express.User, projectId: number) {
  return db.transaction(async (tx) => {
    const project = await deletedProject(tx, user, projectId)
    if (restoreUntil(project.deletedAt!) < new Date())
      throw new ApiError(
        410,
        'restore_expired',
        `${project.code} was deleted more than ${RESTORE_DAYS} days ago: it can no longer be restored.`,
      )
    const [after] = await tx
      .update(projects)
      .set({ deletedAt: null, deletedBy: null, version: sql`${projects.version} + 1` })
      .where(eq(projects.id, projectId))
      .returning()
    await audit(tx, {
      projectId,
      userId: user.id,
      entity: 'project',
      entityId: projectId,
      action: 'restore',
      before: { deletedAt: project.deletedAt },
      after: { deletedAt: null, ...(await contents(tx, projectId)) },
    })
    return after
  })
}

/** Final removal (administrators only), never of a project with intervals issued to designers. */
export async function purgeProject(db: Db, user: Express.User, projectId: number) {
  if (!user.isAdmin) throw forbidden('Only an administrator can purge a project.')
  await db.transaction(async (tx) => {
    const project = await deletedProject(tx, user, projectId)
    const gone = await contents(tx, projectId)
    if (gone.issuedIntervals > 0)
      throw conflict(
        `${project.code} has intervals issued to designers: it stays on record and cannot be purged.`,
        'project_has_issued',
      )
    await tx.delete(projects).where(eq(projects.id, projectId))
    // the project's own audit rows go with it (cascade): the purge is recorded outside it
    await audit(tx, {
      projectId: null,
      userId: user.id,
      entity: 'project',
      entityId: projectId,
      action: 'purge',
      before: { code: project.code, name: project.name, deletedAt: project.deletedAt, ...gone },
    })
  })
}
