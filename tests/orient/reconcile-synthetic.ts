import { planeOfPole, planeToCore, wrap360 } from '../../orient'
import type {
  Line,
  Plane,
  ReconcileCoreItem,
  ReconcileImageItem,
  ReconcileRunItem,
} from '../../orient'
import { fisherSample, seeded } from './sample'

/** A synthetic hole written for these tests: what each side would log, and the runs. */
export interface SyntheticHole {
  core: ReconcileCoreItem[]
  image: ReconcileImageItem[]
  runs: ReconcileRunItem[]
}

export interface SyntheticOptions {
  seed: number
  /** Collar-side depth of the first run, run length and count (m). */
  from?: number
  runLength?: number
  runCount?: number
  /** Planes per run. */
  perRun?: number
  /** True image − core depth difference at a depth (m). */
  shiftAt?: (depth: number) => number
  /** Run index → degrees the orientation line is off: logged beta = true beta − this. */
  turned?: Record<number, number>
  /** Run index → rotation in force now (degrees). */
  applied?: Record<number, number>
  /** Fisher kappa of the measurement noise about each true pole, on each side. */
  kappa?: number
  /** 1σ depth noise on each side (m). */
  depthNoise?: number
  /** Run index → beta reference line (default: 'top' for run 3, else 'bottom'). */
  reference?: (run: number) => 'bottom' | 'top'
}

/** The hole: trend 120, plunge 60 at `from`, curving gently (0.08°/m right, 0.04°/m flatter). */
export const holeAt = (depth: number, from = 100): Line => ({
  trend: 120 + 0.08 * (depth - from),
  plunge: 60 - 0.04 * (depth - from),
})

const SETS: Line[] = [
  { trend: 300, plunge: 45 },
  { trend: 30, plunge: 15 },
  { trend: 200, plunge: 70 },
]

function gauss(random: () => number): number {
  const u = 1 - random()
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random())
}

/** A uniformly random axis in the lower hemisphere. */
function randomPole(random: () => number): Line {
  const z = random()
  return { trend: 360 * random(), plunge: (Math.asin(z) * 180) / Math.PI }
}

function noisy(plane: Plane, kappa: number, random: () => number): Plane {
  const pole = { trend: plane.dipDirection + 180, plunge: 90 - plane.dip }
  return planeOfPole(fisherSample(pole, kappa, 1, random)[0])!
}

/**
 * Planes from three sets (Fisher kappa 40) and 25 % random, each seen once on core and once on the
 * image with independent Fisher noise; the core side is turned into alpha/beta with planeToCore in
 * the hole at its depth, then its run's offset is subtracted from beta.
 */
export function syntheticHole(options: SyntheticOptions): SyntheticHole {
  const random = seeded(options.seed)
  const from = options.from ?? 100
  const runLength = options.runLength ?? 3
  const runCount = options.runCount ?? 6
  const perRun = options.perRun ?? 10
  const kappa = options.kappa ?? 300
  const noise = options.depthNoise ?? 0.02
  const shiftAt = options.shiftAt ?? (() => 0.35)
  const reference = options.reference ?? ((run: number) => (run === 3 ? 'top' : 'bottom'))
  const hole: SyntheticHole = { core: [], image: [], runs: [] }
  for (let r = 0; r < runCount; r++) {
    const top = from + r * runLength
    hole.runs.push({
      id: 100 + r,
      fromDepth: top,
      toDepth: top + runLength,
      appliedRotation: options.applied?.[r] ?? 0,
    })
    const depths = Array.from({ length: perRun }, () => top + runLength * random()).sort(
      (a, b) => a - b,
    )
    for (const depth of depths) {
      const pick = random()
      const pole =
        pick < 0.75
          ? fisherSample(SETS[Math.floor(pick * 4)], 40, 1, random)[0]
          : randomPole(random)
      const plane = planeOfPole(pole)!
      const id = hole.core.length + 1
      // Driller's depth noise, kept inside the run the piece of core came from.
      const coreDepth = Math.min(
        top + runLength - 1e-6,
        Math.max(top, depth + noise * gauss(random)),
      )
      const seen = planeToCore(noisy(plane, kappa, random), holeAt(coreDepth, from), {
        reference: reference(r),
      })!
      hole.core.push({
        id,
        depth: coreDepth,
        alpha: seen.alpha,
        beta: wrap360(seen.beta - (options.turned?.[r] ?? 0)),
        reference: reference(r),
        hole: holeAt(coreDepth, from),
        runId: 100 + r,
      })
      hole.image.push({
        id: 1000 + id,
        depth: depth + shiftAt(depth) + noise * gauss(random),
        plane: noisy(plane, kappa, random),
      })
    }
  }
  return hole
}
