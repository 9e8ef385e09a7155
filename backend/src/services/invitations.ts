import { and, eq, sql } from 'drizzle-orm'
import { memberships, projects, users, type ProjectRole } from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { conflict, forbidden, notFound } from '../http/errors'
import { invitationMail } from '../mail/messages'
import type { Mailer } from '../mail/transport'
import { audit } from './audit'
import { assertUsable, findToken, INVITE_TTL_HOURS, issueToken } from './tokens'

export interface InvitationInput {
  email: string
  projectId?: number
  role?: ProjectRole
}

export const userByEmail = async (db: Executor, email: string) =>
  (
    await db
      .select()
      .from(users)
      .where(eq(sql`lower(${users.email})`, email.toLowerCase()))
  )[0]

/** Admins invite anywhere (or with no project); a project's lead invites into that project only. */
async function checkInviter(db: Db, actor: Express.User, projectId?: number) {
  if (projectId === undefined) {
    if (!actor.isAdmin) throw forbidden('Only an administrator can invite without a project.')
    return null
  }
  const [row] = await db
    .select({ name: projects.name, role: memberships.role })
    .from(projects)
    .leftJoin(
      memberships,
      and(eq(memberships.projectId, projects.id), eq(memberships.userId, actor.id)),
    )
    .where(eq(projects.id, projectId))
  // Not a member → 404, as everywhere: a project's existence never leaks.
  if (!row || (!actor.isAdmin && !row.role)) throw notFound('Project')
  if (!actor.isAdmin && row.role !== 'lead') throw forbidden('Only the project lead can invite.')
  return row.name
}

/** Creates an invitation, mails its link and says whether the mail went out. */
export async function createInvitation(
  db: Db,
  mail: Mailer,
  actor: Express.User,
  input: InvitationInput,
) {
  const projectName = await checkInviter(db, actor, input.projectId)
  const role = input.projectId === undefined ? null : (input.role ?? 'viewer')
  const existing = await userByEmail(db, input.email)
  if (existing && input.projectId !== undefined) {
    const [member] = await db
      .select()
      .from(memberships)
      .where(and(eq(memberships.projectId, input.projectId), eq(memberships.userId, existing.id)))
    if (member) throw conflict('That person is already a member of the project.', 'already_member')
  } else if (existing) throw conflict('An account with that e-mail already exists.', 'user_exists')
  const { token, row } = await db.transaction(async (tx) => {
    const issued = await issueToken(tx, {
      purpose: 'invite',
      email: input.email,
      userId: existing?.id ?? null,
      projectId: input.projectId ?? null,
      role,
      createdBy: actor.id,
      ttlMs: INVITE_TTL_HOURS * 3600_000,
    })
    const { tokenHash: _secret, ...safe } = issued.row
    await audit(tx, {
      projectId: safe.projectId,
      userId: actor.id,
      entity: 'invitation',
      entityId: safe.id,
      action: 'create',
      after: safe,
    })
    return issued
  })
  const link = mail.link(`/invitations/accept?token=${token}`)
  const content = invitationMail({
    inviterName: actor.name,
    projectName,
    role,
    link,
    hours: INVITE_TTL_HOURS,
  })
  let mailed = true
  try {
    await mail.send({ to: input.email, ...content })
  } catch (err: unknown) {
    mailed = false
    mail.logger.warn({ err, invitationId: row.id }, 'invitation mail not sent')
  }
  const { id, email, projectId, expiresAt } = row
  return { id, email, projectId, role: row.role, expiresAt, mailed }
}

/** What the accept page shows; 404 for an unknown token, 410 once used or expired. */
export async function describeInvitation(db: Db, token: string) {
  const row = await findToken(db, 'invite', token)
  if (!row) throw notFound('Invitation')
  assertUsable(row)
  const [project] = row.projectId
    ? await db.select({ name: projects.name }).from(projects).where(eq(projects.id, row.projectId))
    : []
  const existing = await userByEmail(db, row.email)
  return {
    email: row.email,
    projectName: project?.name ?? null,
    role: row.role,
    expiresAt: row.expiresAt,
    existingAccount: Boolean(existing),
  }
}
