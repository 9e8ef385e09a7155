import { DEG2RAD, RAD2DEG } from './math'
import { changedPairs, matchPairs, scalesOf } from './reconcile-match'
import type { PairIndex } from './reconcile-match'
import { axisAngle, corePoleTurned, prepare } from './reconcile-prepare'
import { chooseRotations } from './reconcile-hypotheses'
import { votedRotations } from './reconcile-rotation-vote'
import { alignmentRotations, runResults, runRotations } from './reconcile-runs'
import { depthModelOf, shiftAt } from './reconcile-depth-model'
import type { DepthModel } from './reconcile-depth-model'
import { votedShift } from './reconcile-shift'
import { RECONCILE_DEFAULTS } from './reconcile-types'
import type {
  ReconcileCoreItem,
  ReconcileImageItem,
  ReconcileOptions,
  ReconcileResult,
  ReconcileRunItem,
} from './reconcile-types'

/** Pairing passes at most; the pairing settles in two to four. */
const MAX_PASSES = 6

function resolve(options: ReconcileOptions): Required<ReconcileOptions> {
  const out = { ...RECONCILE_DEFAULTS }
  for (const key of Object.keys(out) as (keyof ReconcileOptions)[]) {
    const value = options[key]
    if (value !== undefined && Number.isFinite(value)) out[key] = value
  }
  return out
}

/**
 * Reconciles structures logged on oriented core with those picked on a televiewer image of the same
 * hole: pairs them one to one and estimates the depth shift (image − core) and, per core run, the
 * rotation of the orientation line to add to the logged betas.
 *
 * 1. Blind start: votedShift takes the mode of the depth differences of all pairs with similar
 *    alpha (a rotation cannot change alpha); votedRotations then finds, per run, the modes of the
 *    rotations asked by the pairs near that shift, and chooseRotations keeps the one (or its
 *    opposite, or the applied rotation) under which the run's own pairing scores best.
 * 2. Pairing: each run's cores are turned by its rotation and matchPairs pairs them one to one
 *    (within ±depthWindow of the depth model, pole angle ≤ maxAngle, greedy by score).
 * 3. Re-estimation: the depth model (median shift, or the linear trend when fitDepthTrend supports
 *    it), each run's rotation (estimateRotation, robust weighted circular mean; used for turning
 *    once minMatches pairs back it, else the applied rotation) and the score scales come from the
 *    pairs; 2 and 3 repeat until the pairing repeats (at most 1 pair in 500 changed; at most
 *    MAX_PASSES).
 * Core items outside runs keep rotation 0 and still take part in the depth shift. Invalid items
 * (non-finite, alpha outside 0–90) are left unmatched. Cost: sorting plus the pairs inside the
 * depth windows, never the full core × image product.
 */
export function reconcileCoreImage(
  core: readonly ReconcileCoreItem[],
  image: readonly ReconcileImageItem[],
  runs: readonly ReconcileRunItem[],
  options: ReconcileOptions = {},
): ReconcileResult {
  const opts = resolve(options)
  const prepared = prepare(core, image, runs)
  const window = opts.depthWindow
  const maxAngle = opts.maxAngle * DEG2RAD
  const first = votedShift(prepared, window, maxAngle)
  let model: DepthModel = { shift: first ?? 0, spread: null, trend: null }
  let scales = scalesOf([], window, maxAngle)
  let pairs: PairIndex[] = []
  let estimates: ReturnType<typeof runRotations> = prepared.runs.map(() => undefined)
  const modes =
    first === undefined
      ? prepared.runs.map(() => [])
      : votedRotations(prepared, first, window, maxAngle, opts.minMatches)
  let turn = chooseRotations(prepared, modes, { shift: first ?? 0, window, maxAngle, ...scales })
  for (let pass = 0; pass < MAX_PASSES && first !== undefined; pass++) {
    const poles = prepared.cores.map((c) => corePoleTurned(c, c.run < 0 ? 0 : turn[c.run]))
    const next = matchPairs(prepared, {
      window,
      maxAngle,
      ...scales,
      shiftAt: shiftAt(model),
      angle: (_, i, m) => axisAngle(poles[i], m.pole),
    })
    // Settled when at most 1 pair in 500 changed (near-ties can swap back and forth for ever).
    const settled = changedPairs(pairs, next) <= Math.floor(next.length / 500)
    pairs = next
    estimates = runRotations(prepared, pairs)
    turn = alignmentRotations(prepared, estimates, opts.minMatches)
    model = depthModelOf(prepared, pairs) ?? model
    scales = scalesOf(pairs, window, maxAngle)
    if (settled || pairs.length === 0) break
  }
  const final = depthModelOf(prepared, pairs)
  const turnOf = (run: number) => (run < 0 ? 0 : turn[run])
  const appliedOf = (run: number) => (run < 0 ? 0 : prepared.runs[run].appliedRotation * DEG2RAD)
  const usedCore = new Uint8Array(prepared.cores.length)
  const usedImage = new Uint8Array(prepared.images.length)
  for (const p of pairs) {
    usedCore[p.core] = 1
    usedImage[p.image] = 1
  }
  return {
    depthShift: final?.shift ?? null,
    depthShiftSpread: final?.spread ?? null,
    depthTrend: final?.trend ?? null,
    matches: pairs.map((p) => {
      const c = prepared.cores[p.core]
      const m = prepared.images[p.image]
      return {
        coreId: c.item.id,
        imageId: m.item.id,
        coreDepth: c.depth,
        imageDepth: m.depth,
        depthDifference: m.depth - c.depth,
        angle: axisAngle(corePoleTurned(c, appliedOf(c.run)), m.pole) * RAD2DEG,
        alignedAngle: axisAngle(corePoleTurned(c, turnOf(c.run)), m.pole) * RAD2DEG,
        score: p.score,
      }
    }),
    unmatchedCore: [
      ...prepared.cores.filter((_, i) => !usedCore[i]).map((c) => c.item.id),
      ...prepared.invalidCore,
    ],
    unmatchedImage: [
      ...prepared.images.filter((_, j) => !usedImage[j]).map((m) => m.item.id),
      ...prepared.invalidImage,
    ],
    runs: runResults(prepared, pairs, estimates, opts),
    options: opts,
  }
}
