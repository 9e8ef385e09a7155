import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm'
import { comments, intervals, holes, memberships, structures, users } from '../../../schema/index'
import type { Db } from '../db/client'
import type { Mailer } from '../mail/transport'
import { notFound } from '../http/errors'
import { audit } from './audit'
import { notifyProject } from './notify'

type Entity = 'structure' | 'interval'

/** The commented thing must belong to the project and a hole not deleted (404 otherwise). */
async function assertInProject(db: Db, projectId: number, entity: Entity, entityId: number) {
  const table = entity === 'structure' ? structures : intervals
  const [row] = await db
    .select({ id: table.id })
    .from(table)
    .innerJoin(holes, eq(holes.id, table.holeId))
    .where(and(eq(table.id, entityId), eq(holes.projectId, projectId), isNull(holes.deletedAt)))
  if (!row) throw notFound(entity === 'structure' ? 'Structure' : 'Interval')
}

export async function listComments(db: Db, projectId: number, entity: Entity, entityId: number) {
  await assertInProject(db, projectId, entity, entityId)
  return db
    .select({
      id: comments.id,
      body: comments.body,
      mentions: comments.mentions,
      createdAt: comments.createdAt,
      userId: comments.userId,
      userName: users.name,
    })
    .from(comments)
    .leftJoin(users, eq(users.id, comments.userId))
    .where(
      and(
        eq(comments.projectId, projectId),
        eq(comments.entity, entity),
        eq(comments.entityId, entityId),
      ),
    )
    .orderBy(asc(comments.createdAt))
}

const EMAIL_MENTION = /@([\w.+-]+@[\w-]+(?:\.[\w-]+)+)/g

/**
 * Adds a comment; members named in `mentions` or written as "@e-mail" in the text are mentioned
 * (non-members are ignored) and told by e-mail.
 */
export async function addComment(
  db: Db,
  mail: Mailer,
  actor: { id: number; name: string },
  projectId: number,
  input: { entity: Entity; entityId: number; body: string; mentions?: number[] },
) {
  await assertInProject(db, projectId, input.entity, input.entityId)
  const emails = [...input.body.matchAll(EMAIL_MENTION)].map((m) => m[1].toLowerCase())
  const named = emails.length
    ? (
        await db
          .select({ id: users.id })
          .from(users)
          .where(inArray(sql`lower(${users.email})`, emails))
      ).map((u) => u.id)
    : []
  const wanted = [...new Set([...(input.mentions ?? []), ...named])]
  const members = wanted.length
    ? (
        await db
          .select({ userId: memberships.userId })
          .from(memberships)
          .where(and(eq(memberships.projectId, projectId), inArray(memberships.userId, wanted)))
      ).map((m) => m.userId)
    : []
  const row = await db.transaction(async (tx) => {
    const [c] = await tx
      .insert(comments)
      .values({
        projectId,
        entity: input.entity,
        entityId: input.entityId,
        userId: actor.id,
        body: input.body,
        mentions: members,
      })
      .returning()
    await audit(tx, {
      projectId,
      userId: actor.id,
      entity: 'comment',
      entityId: c.id,
      action: 'create',
      after: c,
    })
    return c
  })
  if (members.length) {
    await notifyProject(db, mail, {
      projectId,
      userIds: members,
      subject: `${actor.name} mentioned you`,
      text: `${actor.name} wrote on ${input.entity} ${input.entityId}:\n\n${input.body}`,
    })
  }
  return row
}
