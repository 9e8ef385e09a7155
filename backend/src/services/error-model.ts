import { and, asc, eq } from 'drizzle-orm'
import { DEFAULT_ERROR_MODEL } from '../../../orient/index'
import {
  holes,
  projects,
  type ErrorModelAnswer,
  type ErrorModelValues,
  type Project,
} from '../../../schema/index'
import type { Db } from '../db/client'
import type { Mailer } from '../mail/transport'
import { staleVersion } from '../http/errors'
import { audit } from './audit'
import { assertNotFrozen, demoteChecked, noticeDemoted, type Demoted } from './freeze'
import { errorModelOf } from './structure-context'
import { recomputeStructures } from './structure-recompute'

const REASON = "the project's measurement error model changed"
const keys = Object.keys(DEFAULT_ERROR_MODEL) as (keyof ErrorModelValues)[]

/** The project's error model, the defaults beside it and the keys that differ. */
export function errorModelAnswer(project: Project): ErrorModelAnswer {
  const model = errorModelOf(project) as ErrorModelValues
  return {
    model,
    defaults: { ...DEFAULT_ERROR_MODEL },
    changed: keys.filter((k) => model[k] !== DEFAULT_ERROR_MODEL[k]),
    version: project.version,
  }
}

/**
 * Stores a new error model (lead) and recomputes every structure's cone in the project, in one
 * transaction: an approved or issued interval refuses it (409, nothing changes), checked
 * intervals go back to draft (their checker is told after the commit), one audit row per hole
 * and one for the project. An unchanged model only bumps nothing and answers as is.
 */
export async function updateErrorModel(
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  input: { model: ErrorModelValues; version: number },
): Promise<ErrorModelAnswer> {
  const before = errorModelOf(project) as ErrorModelValues
  const changed = keys.filter((k) => before[k] !== input.model[k])
  if (project.version !== input.version) throw staleVersion()
  if (changed.length === 0) return errorModelAnswer(project)
  const demotions: { hole: { id: number; name: string }; demoted: Demoted[] }[] = []
  const after = await db.transaction(async (tx) => {
    const [row] = await tx
      .update(projects)
      .set({ errorModel: input.model, version: input.version + 1, updatedAt: new Date() })
      .where(and(eq(projects.id, project.id), eq(projects.version, input.version)))
      .returning()
    if (!row) throw staleVersion()
    const all = await tx
      .select()
      .from(holes)
      .where(eq(holes.projectId, project.id))
      .orderBy(asc(holes.name))
    for (const hole of all) {
      await assertNotFrozen(
        tx,
        hole.id,
        { hole: true },
        `Changing the error model (hole ${hole.name})`,
      )
      const structures = await recomputeStructures(tx, row, hole)
      if (structures === 0) continue
      const demoted = await demoteChecked(tx, actorId, project.id, hole.id, { hole: true }, REASON)
      demotions.push({ hole: { id: hole.id, name: hole.name }, demoted })
    }
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'project',
      entityId: project.id,
      action: 'update-error-model',
      before: Object.fromEntries(changed.map((k) => [k, before[k]])),
      after: {
        ...Object.fromEntries(changed.map((k) => [k, input.model[k]])),
        holes: demotions.length,
        demotedIntervals: demotions.flatMap((d) => d.demoted.map((x) => x.interval.id)),
      },
    })
    return row
  })
  for (const { hole, demoted } of demotions)
    await noticeDemoted(db, mail, project.id, hole, demoted, REASON)
  return errorModelAnswer(after)
}
