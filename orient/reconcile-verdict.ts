import { BETA_ALPHA_LIMIT, BETA_SENSE_LIMIT } from './reconcile-rotation'
import type { ReconcileOptions, ReconcileRun } from './reconcile-types'

// Two-sided 95 % Student t quantiles t(0.975, df) for df = 1…30 (Student 1908; the values of any
// statistics table, e.g. Abramowitz & Stegun 1964, Table 26.10, from memory).
const T975 = [
  12.706, 4.303, 3.182, 2.776, 2.571, 2.447, 2.365, 2.306, 2.262, 2.228, 2.201, 2.179, 2.16, 2.145,
  2.131, 2.12, 2.11, 2.101, 2.093, 2.086, 2.08, 2.074, 2.069, 2.064, 2.06, 2.056, 2.052, 2.048,
  2.045, 2.042,
]

/** t(0.975, df); above 30 degrees of freedom 1.96 + 2.4/df (within 0.002 of the table to df 120). */
export function studentT975(df: number): number {
  if (df < 1) return Infinity
  return df <= 30 ? T975[Math.floor(df) - 1] : 1.96 + 2.4 / df
}

export interface RunFigures {
  /** Matched pairs in the run. */
  readonly matched: number
  /** Pairs that carried weight in the rotation estimate (defined beta, not rejected as outliers). */
  readonly used: number
  /** Of those, pairs whose beta sense is certain (alpha at least BETA_SENSE_LIMIT). */
  readonly directional: number
  /** Degrees, null when no estimate. */
  readonly residual: number | null
  readonly error: number | null
}

const deg = (x: number) => `${x > 0 ? '+' : ''}${x.toFixed(1)}°`
const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 'es'}`

/**
 * Verdict on a run's orientation line from its residual rotation (estimate − applied):
 * 'ok' when |residual| ≤ okAngle and its standard error ≤ okAngle (a small residual that is itself
 * uncertain is not called ok: 'suspect'); 'wrong' when |residual| > wrongAngle and it is
 * significant, |residual| > t(0.975, n − 1)·standard error (Student 1908); 'suspect' otherwise.
 * null, with the reason, when fewer than minMatches pairs (matched, or with a defined beta) back it
 * or when none of them fixes beta's sense.
 */
export function runVerdict(
  figures: RunFigures,
  options: Required<ReconcileOptions>,
): Pick<ReconcileRun, 'verdict' | 'reason'> {
  const { matched, used, directional, residual, error } = figures
  const { minMatches, okAngle, wrongAngle } = options
  if (matched === 0) return { verdict: null, reason: 'No structure in this run was matched.' }
  if (matched < minMatches)
    return {
      verdict: null,
      reason: `Only ${plural(matched, 'match')}, fewer than the ${minMatches} needed for a verdict.`,
    }
  if (residual === null || error === null || used < minMatches)
    return {
      verdict: null,
      reason: `Only ${used} of ${plural(matched, 'match')} have a defined beta (alpha up to ${BETA_ALPHA_LIMIT}°), fewer than the ${minMatches} needed for a verdict.`,
    }
  if (directional === 0)
    return {
      verdict: null,
      reason: `Every match has alpha below ${BETA_SENSE_LIMIT}°, where beta and beta + 180° look alike, so the rotation is known only to ±180°.`,
    }
  const from =
    used === matched ? plural(matched, 'match') : `${used} of ${plural(matched, 'match')}`
  const size = Math.abs(residual)
  if (size <= okAngle)
    return error <= okAngle
      ? { verdict: 'ok', reason: `Residual ${deg(residual)} from ${from} is within ${okAngle}°.` }
      : {
          verdict: 'suspect',
          reason: `Residual ${deg(residual)} from ${from} is within ${okAngle}° but its standard error ${error.toFixed(1)}° is larger than that.`,
        }
  if (size > wrongAngle) {
    const t = studentT975(used - 1)
    return size > t * error
      ? {
          verdict: 'wrong',
          reason: `Residual ${deg(residual)} from ${from} exceeds ${wrongAngle}°.`,
        }
      : {
          verdict: 'suspect',
          reason: `Residual ${deg(residual)} from ${from} exceeds ${wrongAngle}° but is within ${t.toFixed(2)} standard errors (${error.toFixed(1)}°) of zero.`,
        }
  }
  return {
    verdict: 'suspect',
    reason: `Residual ${deg(residual)} from ${from} is between ${okAngle}° and ${wrongAngle}°.`,
  }
}
