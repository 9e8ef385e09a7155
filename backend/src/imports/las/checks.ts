import type { ProblemLog } from './types'

interface DeclaredIndex {
  start: number | null
  stop: number | null
  step: number | null
  line: number | null
}

/**
 * Compares the depths read with STRT, STOP and STEP from ~W. Mismatches are warnings, not
 * refusals: the samples are what the tool recorded. STEP 0 means irregular sampling (LAS 2.0).
 */
export function checkIndex(depths: Float64Array, declared: DeclaredIndex, problems: ProblemLog) {
  const first = depths[0]
  const last = depths[depths.length - 1]
  const { start, stop, step } = declared
  const tolerance = Math.max(Math.abs(step ?? 0) / 2, 1e-6)
  if (start === null || stop === null) {
    problems.push({
      line: null,
      message: 'STRT or STOP missing from ~W: the depths read are used.',
    })
  } else if (Math.abs(start - first) > tolerance || Math.abs(stop - last) > tolerance) {
    problems.push({
      line: null,
      message: `STRT ${start} / STOP ${stop} differ from the first and last depths read (${first} / ${last}).`,
    })
  }
  if (step === null || step === 0 || depths.length < 2) return
  const slack = Math.abs(step) * 1e-3 + 1e-9
  for (let i = 1; i < depths.length; i++) {
    if (Math.abs(depths[i] - depths[i - 1] - step) > slack) {
      problems.push({
        line: declared.line,
        message: `STEP is ${step} but the depths are spaced irregularly (first at depth ${depths[i - 1]}).`,
      })
      return
    }
  }
}
