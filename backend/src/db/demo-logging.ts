import {
  holeAt,
  planeOfPole,
  planeToCore,
  poleOf,
  type Line,
  type Plane,
} from '../../../orient/index'
import type { RunInputT, StructureInputT } from '../../../schema/index'
import { demoRandom } from './random'

/**
 * Invented structure of the Greyscar Quarry demo: bedding and joint sets per depth domain, each a
 * Fisher distribution (mean plane, concentration kappa). Demo data only.
 */
interface SetSpec {
  type: StructureInputT['type']
  mean: Plane
  kappa: number
  /** Relative abundance within the domain. */
  weight: number
}

/** The demo's design face (the deepened north wall) and friction angle. */
export const demoFace = { faceDip: 70, faceDipDirection: 190, frictionDeg: 30 }

export const demoDomains: { name: string; from: number; to: number; sets: SetSpec[] }[] = [
  {
    name: 'Upper limestone',
    from: 0,
    to: 70,
    sets: [
      { type: 'bedding', mean: { dip: 12, dipDirection: 165 }, kappa: 90, weight: 3 },
      { type: 'joint', mean: { dip: 48, dipDirection: 195 }, kappa: 40, weight: 3 },
      { type: 'joint', mean: { dip: 82, dipDirection: 110 }, kappa: 35, weight: 2 },
      { type: 'joint', mean: { dip: 71, dipDirection: 290 }, kappa: 25, weight: 2 },
    ],
  },
  {
    name: 'Mudstone band',
    from: 70,
    to: 130,
    sets: [
      { type: 'bedding', mean: { dip: 14, dipDirection: 170 }, kappa: 70, weight: 4 },
      { type: 'shear', mean: { dip: 25, dipDirection: 180 }, kappa: 30, weight: 1 },
      { type: 'joint', mean: { dip: 80, dipDirection: 105 }, kappa: 25, weight: 2 },
    ],
  },
  {
    name: 'Lower limestone',
    from: 130,
    to: Infinity,
    sets: [
      { type: 'bedding', mean: { dip: 10, dipDirection: 160 }, kappa: 80, weight: 2 },
      { type: 'joint', mean: { dip: 78, dipDirection: 15 }, kappa: 30, weight: 3 },
      { type: 'joint', mean: { dip: 52, dipDirection: 200 }, kappa: 35, weight: 2 },
      { type: 'vein', mean: { dip: 65, dipDirection: 250 }, kappa: 20, weight: 1 },
    ],
  },
]

/** A pole drawn from a Fisher distribution about `mean` (Fisher, Lewis & Embleton 1987, §3.6). */
function fisherPole(mean: Line, kappa: number, random: () => number): Line {
  const u = random()
  const w = 1 + Math.log(u + (1 - u) * Math.exp(-2 * kappa)) / kappa
  const theta = Math.acos(Math.max(-1, Math.min(1, w)))
  const phi = 2 * Math.PI * random()
  // offset from the mean: rotate toward an arbitrary azimuth by theta
  const t = (mean.trend * Math.PI) / 180
  const p = (mean.plunge * Math.PI) / 180
  const m = [Math.sin(t) * Math.cos(p), Math.cos(t) * Math.cos(p), -Math.sin(p)]
  const a = Math.abs(m[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0]
  const e1 = normalise(cross(m, a))
  const e2 = cross(m, e1)
  const v = m.map(
    (mi, i) =>
      mi * Math.cos(theta) + Math.sin(theta) * (Math.cos(phi) * e1[i] + Math.sin(phi) * e2[i]),
  )
  const down = v[2] > 0 ? v.map((x) => -x) : v
  return {
    trend: ((Math.atan2(down[0], down[1]) * 180) / Math.PI + 360) % 360,
    plunge: (Math.asin(-down[2]) * 180) / Math.PI,
  }
}
const cross = (a: number[], b: number[]) => [
  a[1] * b[2] - a[2] * b[1],
  a[2] * b[0] - a[0] * b[2],
  a[0] * b[1] - a[1] * b[0],
]
const normalise = (v: number[]) => {
  const n = Math.hypot(v[0], v[1], v[2])
  return v.map((x) => x / n)
}

export interface DemoLogging {
  runs: RunInputT[]
  structures: StructureInputT[]
}

/**
 * Runs every 3 m and structures drawn from the domain's sets, turned into alpha/beta with the
 * hole's own survey (planeToCore), so the demo converts back to the sets it was drawn from.
 * Structures sub-parallel to the hole are kept with probability sin(alpha): core under-samples them.
 */
export function demoLogging(
  holeName: string,
  finalDepth: number,
  stations: readonly { depth: number; azimuth: number; plunge: number }[],
): DemoLogging {
  const random = demoRandom(`${holeName}:logging`)
  const runs: RunInputT[] = []
  const structures: StructureInputT[] = []
  for (let from = 0; from < finalDepth - 1e-9; from += 3) {
    const to = Math.min(finalDepth, from + 3)
    const length = to - from
    const r = random()
    const markConfidence = r < 0.06 ? 'none' : r < 0.18 ? 'poor' : r < 0.4 ? 'fair' : 'good'
    const domain = demoDomains.find((d) => from >= d.from && from < d.to)!
    const total = domain.sets.reduce((s, x) => s + x.weight, 0)
    let count = 0
    const perMetre = domain.name === 'Mudstone band' ? 3.2 : 2
    for (let k = 0; k < Math.round(length * perMetre * (0.5 + random())); k++) {
      const depth = Math.round((from + random() * length) * 100) / 100
      let pick = random() * total
      const set = domain.sets.find((s) => (pick -= s.weight) < 0) ?? domain.sets[0]
      const plane = planeOfPole(fisherPole(poleOf(set.mean)!, set.kappa, random))!
      const hole = holeAt(stations, depth)!
      const core = planeToCore(plane, hole)
      if (!core || random() > Math.sin((core.alpha * Math.PI) / 180)) continue
      structures.push({
        depth,
        type: set.type,
        source: 'core',
        alpha: Math.round(core.alpha),
        ...(markConfidence === 'none' ? {} : { beta: Math.round(core.beta) % 360 }),
        jrc: Math.round(4 + random() * 10),
        roughness: (['IV', 'V', 'VII', 'VIII'] as const)[Math.floor(random() * 4)],
        persistence: 'not determined',
      })
      if (set.type !== 'bedding' || random() < 0.5) count++
    }
    const recovered = Math.round(length * (0.93 + 0.07 * random()) * 100) / 100
    const solid = Math.round(recovered * (0.8 + 0.17 * random()) * 100) / 100
    const rqdLength = Math.round(solid * (0.6 + 0.35 * random()) * 100) / 100
    runs.push({
      fromDepth: from,
      toDepth: to,
      recovered,
      solid,
      rqdLength,
      fractureCount: count,
      markConfidence,
      comment: '',
    })
  }
  return { runs, structures: structures.sort((a, b) => a.depth - b.depth) }
}
