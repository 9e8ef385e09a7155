import { and, asc, eq, gte, lt, sql } from 'drizzle-orm'
import {
  structures,
  type Hole,
  type Project,
  type ProjectRole,
  type Structure,
  type StructureInputT,
  type StructureUpdate,
} from '../../../schema/index'
import type { Db, Executor, Tx } from '../db/client'
import { forbidden, notFound, staleVersion } from '../http/errors'
import { roleAtLeast } from '../auth/guards'
import { audit } from './audit'
import { computeStructures, storedInputs, type ComputeContext } from '../../../orient/index'
import { affectedRange, loadComputeContext, lockedAt } from './structure-context'

export const listStructures = (db: Executor, holeId: number) =>
  db
    .select()
    .from(structures)
    .where(eq(structures.holeId, holeId))
    .orderBy(asc(structures.depth), asc(structures.id))

/** API input → the stored input columns (a true orientation goes to inputDip/inputDipDirection). */
export function inputColumns(input: Partial<StructureInputT>) {
  const { dip, dipDirection, ...rest } = input
  return {
    ...rest,
    ...(dip !== undefined ? { inputDip: dip } : {}),
    ...(dipDirection !== undefined ? { inputDipDirection: dipDirection } : {}),
  }
}

/**
 * Recomputes the hole's structures — all of them, or only those a write at the `near` depths can
 * change (their runs: beta jumps compare neighbours) — with the survey and runs read once. Returns
 * how many rows were written.
 */
export async function recomputeStructures(
  tx: Executor,
  project: Project,
  hole: Hole,
  near?: number[],
): Promise<number> {
  const ctx = await loadComputeContext(tx, project, hole)
  if (!near) return recomputeRange(tx, ctx, hole)
  const ranges = new Map(
    near.map((depth) => {
      const r = affectedRange(ctx, depth)
      return [`${r.from}/${r.to}`, r]
    }),
  )
  let written = 0
  for (const range of ranges.values()) written += await recomputeRange(tx, ctx, hole, range)
  return written
}

/** Recomputes the structures in [from, to) (all without a range) and writes them in one statement. */
async function recomputeRange(
  tx: Executor,
  ctx: ComputeContext,
  hole: Hole,
  range?: { from: number; to: number },
): Promise<number> {
  const where = range
    ? and(
        eq(structures.holeId, hole.id),
        gte(structures.depth, range.from),
        lt(structures.depth, range.to),
      )
    : eq(structures.holeId, hole.id)
  const rows = await tx
    .select()
    .from(structures)
    .where(where)
    .orderBy(asc(structures.depth), asc(structures.id))
  if (rows.length === 0) return 0
  // Every source is recomputed from its inputs: core angles, true orientation, or the raw pick.
  const computed = computeStructures(ctx, rows.map(storedInputs))
  const payload = rows.map((r, i) => ({
    id: r.id,
    ...computed[i],
    survey_revision: hole.surveyRevision,
  }))
  await tx.execute(sql`
    update structures s set
      dip = v."dip", dip_direction = v."dipDirection", pole_trend = v."poleTrend", pole_plunge = v."polePlunge",
      hole_trend = v."holeTrend", hole_plunge = v."holePlunge", east = v."east", north = v."north",
      elevation = v."elevation", terzaghi_weight = v."terzaghiWeight",
      declination_applied = v."declinationApplied", flags = v."flags", survey_revision = v.survey_revision
    from jsonb_to_recordset(${JSON.stringify(payload)}::jsonb) as v(
      id int, "dip" float8, "dipDirection" float8, "poleTrend" float8, "polePlunge" float8,
      "holeTrend" float8, "holePlunge" float8, "east" float8, "north" float8, "elevation" float8,
      "terzaghiWeight" float8, "declinationApplied" float8, "flags" text[], survey_revision int)
    where s.id = v.id`)
  return rows.length
}

async function assertUnlocked(db: Executor, role: ProjectRole, holeId: number, depths: number[]) {
  if (roleAtLeast(role, 'engineer')) return
  for (const d of depths) {
    if (await lockedAt(db, holeId, d)) {
      throw forbidden(
        `Depth ${d} m lies in a checked interval: only engineers and leads can change it.`,
      )
    }
  }
}

async function reread(tx: Tx, id: number): Promise<Structure> {
  const [row] = await tx.select().from(structures).where(eq(structures.id, id))
  return row
}

export async function createStructure(
  db: Db,
  actor: { id: number; role: ProjectRole },
  project: Project,
  hole: Hole,
  input: StructureInputT,
): Promise<Structure> {
  return db.transaction(async (tx) => {
    await assertUnlocked(tx, actor.role, hole.id, [input.depth])
    const [row] = await tx
      .insert(structures)
      .values({
        ...inputColumns(input),
        depth: input.depth,
        type: input.type,
        holeId: hole.id,
        createdBy: actor.id,
        updatedBy: actor.id,
      })
      .returning({ id: structures.id })
    await recomputeStructures(tx, project, hole, [input.depth])
    const after = await reread(tx, row.id)
    await audit(tx, {
      projectId: project.id,
      userId: actor.id,
      entity: 'structure',
      entityId: row.id,
      action: 'create',
      after,
    })
    return after
  })
}

export async function getStructure(db: Executor, holeId: number, id: number): Promise<Structure> {
  const [row] = await db
    .select()
    .from(structures)
    .where(and(eq(structures.id, id), eq(structures.holeId, holeId)))
  if (!row) throw notFound('Structure')
  return row
}

export async function updateStructure(
  db: Db,
  actor: { id: number; role: ProjectRole },
  project: Project,
  hole: Hole,
  id: number,
  input: StructureUpdate,
): Promise<Structure> {
  const { version, ...fields } = input
  return db.transaction(async (tx) => {
    const before = await getStructure(tx, hole.id, id)
    await assertUnlocked(tx, actor.role, hole.id, [before.depth, fields.depth ?? before.depth])
    const [updated] = await tx
      .update(structures)
      .set({
        ...inputColumns(fields),
        updatedBy: actor.id,
        updatedAt: new Date(),
        version: version + 1,
      })
      .where(and(eq(structures.id, id), eq(structures.version, version)))
      .returning({ id: structures.id })
    if (!updated) throw staleVersion()
    await recomputeStructures(tx, project, hole, [before.depth, fields.depth ?? before.depth])
    const after = await reread(tx, id)
    await audit(tx, {
      projectId: project.id,
      userId: actor.id,
      entity: 'structure',
      entityId: id,
      action: 'update',
      before,
      after,
    })
    return after
  })
}

export async function deleteStructure(
  db: Db,
  actor: { id: number; role: ProjectRole },
  project: Project,
  hole: Hole,
  id: number,
  version: number,
): Promise<void> {
  await db.transaction(async (tx) => {
    const before = await getStructure(tx, hole.id, id)
    await assertUnlocked(tx, actor.role, hole.id, [before.depth])
    const [gone] = await tx
      .delete(structures)
      .where(and(eq(structures.id, id), eq(structures.version, version)))
      .returning({ id: structures.id })
    if (!gone) throw staleVersion()
    await recomputeStructures(tx, project, hole, [before.depth])
    await audit(tx, {
      projectId: project.id,
      userId: actor.id,
      entity: 'structure',
      entityId: id,
      action: 'delete',
      before,
    })
  })
}
