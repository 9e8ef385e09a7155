import { eq } from 'drizzle-orm'
import { memberships, projects } from '../../../schema/index'
import type { Executor } from '../db/client'

/** The projects a user belongs to, with the role held in each. */
export async function membershipsOf(db: Executor, userId: number) {
  return db
    .select({
      projectId: projects.id,
      projectCode: projects.code,
      projectName: projects.name,
      role: memberships.role,
    })
    .from(memberships)
    .innerJoin(projects, eq(projects.id, memberships.projectId))
    .where(eq(memberships.userId, userId))
    .orderBy(projects.code)
}
