import { asc, eq, inArray } from 'drizzle-orm'
import {
  azimuthSdAt,
  setMeanSystematic95,
  storedInputs,
  uncertaintyColumnsOf,
  type UncertaintyRow,
} from '../../../orient/index'
import { holes, projects, structures, surveyStations } from '../../../schema/index'
import type { Executor } from '../db/client'
import { errorModelOf } from './structure-context'

export interface SetMembersForUncertainty {
  setId: number
  ids: number[]
  weights: number[]
}

/**
 * Each set mean's systematic term: the 95 % cone of the mean pole under the survey errors that
 * every structure of the hole shares (orient setMeanSystematic95, with the project's error model),
 * recomputing every member through the conversion the product uses. Independent reading errors are
 * left to the set's Fisher alpha95. Keyed by set id; sets without members are left out.
 */
export async function setSystematicTerms(
  db: Executor,
  holeId: number,
  sets: readonly SetMembersForUncertainty[],
): Promise<Map<number, number>> {
  const out = new Map<number, number>()
  const ids = sets.flatMap((s) => s.ids)
  if (ids.length === 0) return out
  // One after another: the analysis may run inside a transaction (one connection).
  const [context] = await db
    .select({ errorModel: projects.errorModel, referenceLine: projects.referenceLine })
    .from(holes)
    .innerJoin(projects, eq(projects.id, holes.projectId))
    .where(eq(holes.id, holeId))
  const stations = await db
    .select({ depth: surveyStations.depth, method: surveyStations.method })
    .from(surveyStations)
    .where(eq(surveyStations.holeId, holeId))
    .orderBy(asc(surveyStations.depth))
  const rows = await db.select().from(structures).where(inArray(structures.id, ids))
  if (!context) return out
  const model = errorModelOf(context)
  const byId = new Map(rows.map((r) => [r.id, r]))
  for (const set of sets) {
    const members: UncertaintyRow[] = []
    const weights: number[] = []
    set.ids.forEach((id, i) => {
      const r = byId.get(id)
      if (!r || r.holeTrend === null || r.holePlunge === null || r.dip === null) return
      const inputs = storedInputs(r)
      members.push({
        source: r.source,
        alpha: r.alpha,
        beta: r.beta,
        reference: r.referenceLine ?? context.referenceLine,
        betaRotation: r.betaRotationApplied,
        hole: { trend: r.holeTrend, plunge: r.holePlunge },
        azimuthSd: azimuthSdAt(stations, r.depth, model),
        pick: inputs.pick,
        dip: r.dip,
        dipDirection: r.dipDirection,
      })
      weights.push(set.weights[i])
    })
    if (members.length === 0) continue
    const value = setMeanSystematic95(
      uncertaintyColumnsOf(members),
      new Int32Array(members.length),
      Float64Array.from(weights),
      model,
    )
    if (value !== undefined && Number.isFinite(value)) out.set(set.setId, value)
  }
  return out
}
