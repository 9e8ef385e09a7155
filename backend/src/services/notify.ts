import { and, eq, inArray, or } from 'drizzle-orm'
import { memberships, projects, users, type ProjectRole } from '../../../schema/index'
import type { Db } from '../db/client'
import { notificationMail } from '../mail/messages'
import type { Mailer } from '../mail/transport'

export interface ProjectNotice {
  projectId: number
  /** Members holding one of these roles are told. */
  roles?: ProjectRole[]
  /** These users are told too, provided they belong to the project (mentions, authors). */
  userIds?: number[]
  subject: string
  text: string
  /** A path in the app (`/projects/3/...`) or an absolute URL. */
  link?: string
}

/**
 * Mails a notice to the project's members with one of `roles` plus `userIds`, once each;
 * disabled users are skipped. Resolves to the number of mails sent. Never throws on a mail
 * failure (it is logged): a write must not fail because mail is down.
 */
export async function notifyProject(
  db: Db,
  mail: Mailer,
  n: {
    projectId: number
    roles?: ProjectRole[]
    userIds?: number[]
    subject: string
    text: string
    link?: string
  },
): Promise<number> {
  const notice: ProjectNotice = n
  const roles = notice.roles ?? []
  const userIds = notice.userIds ?? []
  if (roles.length === 0 && userIds.length === 0) return 0
  try {
    const [project] = await db
      .select({ name: projects.name })
      .from(projects)
      .where(eq(projects.id, notice.projectId))
    if (!project) return 0
    const conditions = [
      ...(roles.length ? [inArray(memberships.role, roles)] : []),
      ...(userIds.length ? [inArray(users.id, userIds)] : []),
    ]
    // Only members: a notice names project work, which outsiders must not learn about.
    const recipients = await db
      .selectDistinct({ id: users.id, email: users.email })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(
        and(
          eq(memberships.projectId, notice.projectId),
          eq(users.disabled, false),
          or(...conditions),
        ),
      )
    const content = notificationMail({
      projectName: project.name,
      subject: notice.subject,
      text: notice.text,
      link: notice.link ? mail.link(notice.link) : undefined,
    })
    const results = await Promise.allSettled(
      recipients.map((r) => mail.send({ to: r.email, ...content })),
    )
    results.forEach((r, i) => {
      if (r.status === 'rejected')
        mail.logger.warn({ err: r.reason, to: recipients[i].email }, 'notification not sent')
    })
    return results.filter((r) => r.status === 'fulfilled').length
  } catch (err: unknown) {
    mail.logger.error({ err, projectId: notice.projectId }, 'notifications not sent')
    return 0
  }
}
