import { finite } from './math'

/**
 * RQD (%) expected from a fracture frequency lambda (per metre) with negative-exponential spacing
 * (Priest & Hudson 1976, IJRMMS 13:135): 100 e^(−λt)(λt + 1), t the piece-length threshold in
 * metres (0.1 for Deere's RQD). Undefined for negative or non-finite input.
 */
export function rqdFromFrequency(lambda: number, threshold = 0.1): number | undefined {
  if (!finite(lambda, threshold) || lambda < 0 || threshold < 0) return undefined
  const lt = lambda * threshold
  return 100 * Math.exp(-lt) * (lt + 1)
}

/** Rock quality classes of Deere (1964), as in ASTM D6032. */
export type RqdClass = 'very poor' | 'poor' | 'fair' | 'good' | 'excellent'

/** Deere class of an RQD: 0–25 very poor, 25–50 poor, 50–75 fair, 75–90 good, 90–100 excellent. */
export function rqdClass(rqd: number): RqdClass | undefined {
  if (!finite(rqd) || rqd < 0) return undefined
  // A bound belongs to the better class: RQD 25 is poor, 90 excellent.
  if (rqd < 25) return 'very poor'
  if (rqd < 50) return 'poor'
  if (rqd < 75) return 'fair'
  if (rqd < 90) return 'good'
  return 'excellent'
}

/** A core run as logged: depths (m) and lengths (m), natural fracture count. */
export interface CoreRun {
  readonly from: number
  readonly to: number
  /** Total core recovered. */
  readonly recovered: number
  /** Solid, full-diameter core. */
  readonly solid: number
  /** Sum of sound pieces ≥ 0.1 m (Deere). */
  readonly rqdLength: number
  /** Natural fractures in the run. */
  readonly fractures: number
}

/** Inconsistencies a run can carry; values are reported as measured, never clipped. */
export type RunFlag = 'over-recovery' | 'solid-exceeds-recovered' | 'rqd-exceeds-recovered'

export interface RunMetrics {
  /** Total core recovery, % of run length. */
  readonly tcr: number
  /** Solid core recovery, %. */
  readonly scr: number
  /** Deere RQD, %. */
  readonly rqd: number
  /** Natural fractures per metre of run. */
  readonly frequency: number
  readonly rqdClass: RqdClass
  readonly flags: readonly RunFlag[]
}

/**
 * TCR, SCR and RQD (% of run length), fracture frequency (per metre) and Deere class of a run.
 * Recovered > run length (core left from the previous run, or a depth error) gives TCR above 100
 * and the flag 'over-recovery': nothing is clipped, so the logger sees and fixes it; the class is
 * then read from min(RQD, 100). Undefined for a zero-length or inverted run and for negative or
 * non-finite values.
 */
export function runMetrics(run: CoreRun): RunMetrics | undefined {
  const { from, to, recovered, solid, rqdLength, fractures } = run
  if (!finite(from, to, recovered, solid, rqdLength, fractures)) return undefined
  const length = to - from
  if (!(length > 0) || Math.min(recovered, solid, rqdLength, fractures) < 0) return undefined
  const flags: RunFlag[] = []
  if (recovered > length) flags.push('over-recovery')
  if (solid > recovered) flags.push('solid-exceeds-recovered')
  if (rqdLength > recovered) flags.push('rqd-exceeds-recovered')
  const rqd = (100 * rqdLength) / length
  return {
    tcr: (100 * recovered) / length,
    scr: (100 * solid) / length,
    rqd,
    frequency: fractures / length,
    rqdClass: rqdClass(Math.min(rqd, 100)) ?? 'very poor',
    flags,
  }
}

/** A core run under the names the database and the API use (metres, natural fracture count). */
export interface LoggedRun {
  readonly fromDepth: number
  readonly toDepth: number
  readonly recovered: number
  readonly solid: number
  readonly rqdLength: number
  readonly fractureCount: number
}

/** runMetrics of a logged run: the one mapping from its names, for the server and the browser. */
export function runMetricsOf(run: LoggedRun): RunMetrics | undefined {
  return runMetrics({
    from: run.fromDepth,
    to: run.toDepth,
    recovered: run.recovered,
    solid: run.solid,
    rqdLength: run.rqdLength,
    fractures: run.fractureCount,
  })
}
