import {
  angleBetweenPlanes,
  combinedCone95,
  fisherStats,
  kinematicChecks,
  planeIntersection,
  planeOfPole,
  setMembership,
  type Line,
  type Plane,
} from '../../../orient/index'
import { eq } from 'drizzle-orm'
import {
  domains,
  type AnalysisOptions,
  type Interval,
  type StructureSet,
} from '../../../schema/index'
import type { Executor } from '../db/client'
import { loadIntervalData, type IntervalStructure } from './interval-data'
import { resolveSettings, type AnalysisSettings } from './intervals'
import { setSystematicTerms } from './set-uncertainty'

/** ISRM (1978) spacing classes, millimetres. */
const spacingClasses: [number, string][] = [
  [20, 'extremely close'],
  [60, 'very close'],
  [200, 'close'],
  [600, 'moderate'],
  [2000, 'wide'],
  [6000, 'very wide'],
  [Infinity, 'extremely wide'],
]
export const isrmSpacingClass = (mm: number) => spacingClasses.find(([limit]) => mm < limit)![1]

const poleOfRow = (s: IntervalStructure): Line => ({ trend: s.poleTrend!, plunge: s.polePlunge! })
const round = (x: number | undefined, d = 2) =>
  x === undefined || !Number.isFinite(x) ? null : Number(x.toFixed(d))

/**
 * Members of each set: explicit members first (sets edited by hand or clustered), then the
 * remaining oriented structures by cone (nearest centre wins where cones overlap).
 */
export function assignSets(
  rows: IntervalStructure[],
  sets: StructureSet[],
  members: { setId: number; structureId: number }[],
) {
  const bySet = new Map<number, number>(members.map((m) => [m.structureId, m.setId]))
  const cones = sets.filter((s) => s.rule === 'cone')
  const free = rows.filter((r) => r.dip !== null && !bySet.has(r.id))
  const idx = setMembership(
    free.map(poleOfRow),
    cones.map((c) => ({
      mean: { trend: c.centreTrend, plunge: c.centrePlunge },
      angle: c.coneAngle,
    })),
  )
  free.forEach((r, i) => {
    if (idx[i] >= 0) bySet.set(r.id, cones[idx[i]].id)
  })
  return bySet
}

/** Mean spacing along the hole between consecutive members, and true spacing = apparent × |cos δ|. */
function spacing(rows: IntervalStructure[], meanPole: Line | undefined, hole: Line | undefined) {
  if (rows.length < 2 || !meanPole || !hole) return null
  const apparent = (rows[rows.length - 1].depth - rows[0].depth) / (rows.length - 1)
  const rad = Math.PI / 180
  const v = (l: Line) => [
    Math.sin(l.trend * rad) * Math.cos(l.plunge * rad),
    Math.cos(l.trend * rad) * Math.cos(l.plunge * rad),
    -Math.sin(l.plunge * rad),
  ]
  const [a, b] = [v(meanPole), v(hole)]
  const cosDelta = Math.abs(a[0] * b[0] + a[1] * b[1] + a[2] * b[2])
  const trueSpacing = apparent * cosDelta
  return {
    apparent: round(apparent, 3),
    true: round(trueSpacing, 3),
    isrmClass: isrmSpacingClass(trueSpacing * 1000),
  }
}

/**
 * An interval's set table, intersections of set means, and kinematic screening against the
 * interval's design face — computed with orient, the numbers the page shows. Settings come from
 * the interval unless `options` overrides them; `settings` says which were used and which differ.
 */
export async function analyseInterval(
  db: Executor,
  interval: Interval,
  options: AnalysisOptions = {},
) {
  const settings = resolveSettings(interval, options)
  const used = settings.used
  const data = await loadIntervalData(db, interval, options)
  const oriented = data.structures.filter((s) => s.dip !== null && s.poleTrend !== null)
  const weightOf = (s: IntervalStructure) =>
    used.weighting === 'terzaghi' ? (s.terzaghiWeight ?? 1) : 1
  const bySet = assignSets(data.structures, data.sets, data.members)
  const memberRows = (setId: number) => oriented.filter((s) => bySet.get(s.id) === setId)
  const systematic = await setSystematicTerms(
    db,
    interval.holeId,
    data.sets.map((set) => {
      const rows = memberRows(set.id)
      return { setId: set.id, ids: rows.map((r) => r.id), weights: rows.map(weightOf) }
    }),
  )
  const sets = data.sets.map((set) => {
    const rows = memberRows(set.id)
    const stats = fisherStats(rows.map(poleOfRow), { weights: rows.map(weightOf) })
    const mean: Plane | undefined = stats ? planeOfPole(stats.mean) : undefined
    return {
      id: set.id,
      name: set.name,
      rule: set.rule,
      centreTrend: set.centreTrend,
      centrePlunge: set.centrePlunge,
      coneAngle: set.coneAngle,
      version: set.version,
      count: rows.length,
      weightedCount: round(
        rows.reduce((s, r) => s + weightOf(r), 0),
        1,
      ),
      percent: round(oriented.length ? (100 * rows.length) / oriented.length : 0, 1),
      mean: mean ? { dip: round(mean.dip)!, dipDirection: round(mean.dipDirection)! } : null,
      meanPole: stats
        ? { trend: round(stats.mean.trend)!, plunge: round(stats.mean.plunge)! }
        : null,
      kappa: round(stats?.kappa, 1),
      alpha95: round(stats?.alpha95),
      // The survey error shared by the hole's structures does not average out with more of them.
      systematic95: round(systematic.get(set.id)),
      uncertainty95: round(
        stats ? (combinedCone95(stats.alpha95, systematic.get(set.id)) ?? undefined) : undefined,
      ),
      sphericalVariance: round(stats?.sphericalVariance, 4),
      spacing: spacing(rows, stats?.mean, data.hole),
      plane: mean,
    }
  })
  const withMeans = sets.filter((s) => s.plane)
  const intersections = []
  for (let i = 0; i < withMeans.length; i++) {
    for (let j = i + 1; j < withMeans.length; j++) {
      const [a, b] = [withMeans[i], withMeans[j]]
      const line = planeIntersection(a.plane!, b.plane!)
      intersections.push({
        setA: a.id,
        setB: b.id,
        nameA: a.name,
        nameB: b.name,
        trend: round(line?.trend),
        plunge: round(line?.plunge),
        angle: round(angleBetweenPlanes(a.plane!, b.plane!)),
      })
    }
  }
  const [domain] = interval.domainId
    ? await db.select({ name: domains.name }).from(domains).where(eq(domains.id, interval.domainId))
    : []
  return {
    interval: { ...interval, domainName: domain?.name ?? null },
    settings,
    hole: data.hole ? { trend: round(data.hole.trend), plunge: round(data.hole.plunge) } : null,
    counts: {
      total: data.structures.length,
      oriented: oriented.length,
      unoriented: data.structures.length - oriented.length,
      flagged: data.structures.filter((s) => s.flags.length > 0).length,
    },
    structures: data.structures.map((s) => ({ ...s, setId: bySet.get(s.id) ?? null })),
    sets: sets.map(({ plane: _p, ...rest }) => rest),
    intersections,
    kinematics: kinematics(used, oriented, withMeans),
  }
}

function kinematics(
  used: AnalysisSettings,
  oriented: IntervalStructure[],
  sets: { id: number; plane?: Plane }[],
) {
  if (used.faceDip == null || used.faceDipDirection == null || used.frictionDeg == null) return null
  const settings = {
    face: { dip: used.faceDip, dipDirection: used.faceDipDirection },
    friction: used.frictionDeg,
    lateralLimit: used.lateralLimitDeg,
    topplingLimit: used.topplingLimitDeg,
  }
  // Planar and toppling per structure (no pairs: O(n)); wedges per pair of set means.
  const perStructure = kinematicChecks(
    settings,
    oriented.map((s) => ({ dip: s.dip!, dipDirection: s.dipDirection! })),
    [],
  )
  const perSet = kinematicChecks(
    settings,
    sets.map((s) => s.plane!),
  )
  if (!perStructure || !perSet) return null
  const share = (n: number, of: number) => round(of ? (100 * n) / of : 0, 1)
  const planarN = perStructure.planar.filter((v) => v.possible).length
  const topplingN = perStructure.toppling.filter((v) => v.possible).length
  const wedgeN = perSet.wedge.filter((v) => v.possible).length
  return {
    ...settings,
    planar: { possible: planarN, percent: share(planarN, oriented.length) },
    toppling: { possible: topplingN, percent: share(topplingN, oriented.length) },
    wedge: { possible: wedgeN, percent: share(wedgeN, perSet.wedge.length) },
    items: oriented.map((s, i) => ({
      structureId: s.id,
      planar: { possible: perStructure.planar[i].possible, reason: perStructure.planar[i].reason },
      toppling: {
        possible: perStructure.toppling[i].possible,
        reason: perStructure.toppling[i].reason,
      },
    })),
    pairs: perSet.wedge.map((w) => ({
      setA: sets[w.a].id,
      setB: sets[w.b].id,
      trend: round(w.line?.trend),
      plunge: round(w.line?.plunge),
      possible: w.possible,
      slidesOn: w.slidesOn ?? null,
      reason: w.reason,
    })),
  }
}
