import { DEG2RAD } from './math'
import { axisAngle, corePoleTurned, lowerBound } from './reconcile-prepare'
import type { Prepared } from './reconcile-prepare'
import { wrapPi } from './reconcile-rotation'

export interface HypothesisSettings {
  /** Image − core depth shift expected (m). */
  readonly shift: number
  readonly window: number
  /** rad. */
  readonly maxAngle: number
  readonly sigmaDepth: number
  readonly sigmaAngle: number
}

/** Total score of the run's cores paired greedily, one to one, with their poles turned by theta. */
function runScore(
  prepared: Prepared,
  members: readonly number[],
  theta: number,
  settings: HypothesisSettings,
): number {
  const { images, imageDepths } = prepared
  const { shift, window, maxAngle, sigmaDepth, sigmaAngle } = settings
  const candidates: { core: number; image: number; score: number }[] = []
  for (const i of members) {
    const core = prepared.cores[i]
    const pole = corePoleTurned(core, theta)
    const expected = core.depth + shift
    for (let j = lowerBound(imageDepths, expected - window); j < images.length; j++) {
      const r = images[j].depth - expected
      if (r > window) break
      const angle = axisAngle(pole, images[j].pole)
      if (angle > maxAngle) continue
      const score = Math.exp(-0.5 * ((r / sigmaDepth) ** 2 + (angle / sigmaAngle) ** 2))
      candidates.push({ core: i, image: j, score })
    }
  }
  candidates.sort((a, b) => b.score - a.score || a.core - b.core || a.image - b.image)
  const usedCore = new Set<number>()
  const usedImage = new Set<number>()
  let total = 0
  for (const c of candidates) {
    if (usedCore.has(c.core) || usedImage.has(c.image)) continue
    usedCore.add(c.core)
    usedImage.add(c.image)
    total += c.score
  }
  return total
}

/**
 * The rotation (rad) each run starts from: of the vote's modes (votedRotations), each mode turned
 * by a further 180° (low-alpha planes cannot tell the two apart, so a mode may sit on the wrong
 * sense) and the applied rotation, the one whose own one-to-one pairing of the run's cores scores
 * highest in total (scores as in matchPairs). A wrong hypothesis pairs fewer cores, and at larger
 * angles, than the true one, so this keeps a run from settling on a pairing that agrees only with
 * itself. Runs without modes start from their applied rotation.
 */
export function chooseRotations(
  prepared: Prepared,
  modes: readonly (readonly number[])[],
  settings: HypothesisSettings,
): Float64Array {
  const members = prepared.runs.map(() => [] as number[])
  prepared.cores.forEach((core, i) => {
    if (core.run >= 0) members[core.run].push(i)
  })
  return Float64Array.from(prepared.runs, (run, k) => {
    const applied = run.appliedRotation * DEG2RAD
    if (modes[k].length === 0) return applied
    const hypotheses: number[] = []
    for (const theta of [...modes[k], ...modes[k].map((m) => m + Math.PI), applied]) {
      const t = wrapPi(theta)
      if (hypotheses.every((h) => Math.abs(wrapPi(h - t)) > DEG2RAD)) hypotheses.push(t)
    }
    let best = hypotheses[0]
    let bestScore = -1
    for (const theta of hypotheses) {
      const score = runScore(prepared, members[k], theta, settings)
      if (score > bestScore) {
        bestScore = score
        best = theta
      }
    }
    return best
  })
}
