import { and, eq, isNull } from 'drizzle-orm'
import {
  holes,
  memberships,
  projects,
  users,
  type Project,
  type ProjectCreate,
  type ProjectRole,
  type ProjectUpdate,
} from '../../../schema/index'
import type { Db } from '../db/client'
import type { Mailer } from '../mail/transport'
import { badRequest, notFound, staleVersion } from '../http/errors'
import { audit } from './audit'
import {
  checkConvergenceSettings,
  checkDeclinationSettings,
  convergenceDetail,
} from './declination'
import { crsDefinition } from './crs'
import {
  conventionsChanged,
  noticeConventionDemotions,
  recomputeConventions,
  type HoleDemotions,
} from './settings-recompute'

export async function listProjectsFor(db: Db, user: Express.User) {
  if (user.isAdmin) {
    const rows = await db
      .select()
      .from(projects)
      .where(isNull(projects.deletedAt))
      .orderBy(projects.code)
    return rows.map((p) => ({ ...p, role: 'lead' as ProjectRole }))
  }
  const rows = await db
    .select({ project: projects, role: memberships.role })
    .from(memberships)
    .innerJoin(projects, eq(projects.id, memberships.projectId))
    .where(and(eq(memberships.userId, user.id), isNull(projects.deletedAt)))
    .orderBy(projects.code)
  return rows.map((r) => ({ ...r.project, role: r.role }))
}

/** Admin creates a project and names its lead, in one audited transaction. */
export async function createProject(
  db: Db,
  actorId: number,
  input: ProjectCreate,
): Promise<Project> {
  const { leadUserId, ...given } = input
  // Convergence defaults to the CRS's own unless the CRS cannot be projected: then it is manual.
  const fields = {
    ...given,
    convergenceMode:
      given.convergenceMode ??
      (crsDefinition(given.crsEpsg) ? ('auto' as const) : ('manual' as const)),
  }
  checkDeclinationSettings(fields)
  checkConvergenceSettings(fields, given)
  return db.transaction(async (tx) => {
    const [lead] = await tx.select({ id: users.id }).from(users).where(eq(users.id, leadUserId))
    if (!lead)
      throw badRequest('No such user', [{ path: 'body.leadUserId', message: 'no such user' }])
    const [project] = await tx.insert(projects).values(fields).returning()
    await tx.insert(memberships).values({ projectId: project.id, userId: leadUserId, role: 'lead' })
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'project',
      entityId: project.id,
      action: 'create',
      after: { ...project, leadUserId },
    })
    return project
  })
}

/**
 * Lead edits settings; a stale `version` → 409. A change of declination, convergence or CRS
 * corrects every survey station again and recomputes the structures of the holes it changes, in
 * the same transaction (or refuses 409 when that would change an approved interval).
 */
export async function updateProject(
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  input: ProjectUpdate,
): Promise<Project> {
  const { version, ...fields } = input
  checkDeclinationSettings({ ...project, ...fields })
  checkConvergenceSettings({ ...project, ...fields }, fields)
  let demotions: HoleDemotions[] = []
  const updated = await db.transaction(async (tx) => {
    const [after] = await tx
      .update(projects)
      .set({ ...fields, version: version + 1, updatedAt: new Date() })
      .where(and(eq(projects.id, project.id), eq(projects.version, version)))
      .returning()
    if (!after) throw staleVersion()
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'project',
      entityId: project.id,
      action: 'update',
      before: project,
      after,
    })
    if (conventionsChanged(project, after))
      demotions = await recomputeConventions(tx, actorId, after)
    return after
  })
  await noticeConventionDemotions(db, mail, project.id, demotions)
  return updated
}

/** The grid convergence each hole of the project gets, and where it comes from. */
export async function collarConvergence(db: Db, project: Project) {
  const rows = await db
    .select({
      holeId: holes.id,
      name: holes.name,
      collarEast: holes.collarEast,
      collarNorth: holes.collarNorth,
    })
    .from(holes)
    .where(eq(holes.projectId, project.id))
    .orderBy(holes.name)
  return rows.map((h) => ({ holeId: h.holeId, name: h.name, ...convergenceDetail(project, h) }))
}

export async function listMembers(db: Db, projectId: number) {
  return db
    .select({ userId: users.id, email: users.email, name: users.name, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.projectId, projectId))
    .orderBy(users.name)
}

export async function changeMember(
  db: Db,
  actorId: number,
  projectId: number,
  userId: number,
  role: ProjectRole | null,
) {
  return db.transaction(async (tx) => {
    const where = and(eq(memberships.projectId, projectId), eq(memberships.userId, userId))
    const [before] = await tx.select().from(memberships).where(where)
    if (!before) throw notFound('Member')
    if (before.role === 'lead' && role !== 'lead') {
      const leads = await tx
        .select({ userId: memberships.userId })
        .from(memberships)
        .where(and(eq(memberships.projectId, projectId), eq(memberships.role, 'lead')))
      if (leads.length === 1)
        throw badRequest('A project keeps at least one lead.', [], 'last_lead')
    }
    const [after] = role
      ? await tx.update(memberships).set({ role }).where(where).returning()
      : await tx.delete(memberships).where(where).returning()
    await audit(tx, {
      projectId,
      userId: actorId,
      entity: 'membership',
      entityId: userId,
      action: role ? 'update' : 'delete',
      before,
      after: role ? after : null,
    })
    return role ? after : null
  })
}
