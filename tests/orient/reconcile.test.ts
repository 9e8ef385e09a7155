import { describe, expect, it } from 'vitest'
import { planeToCore, reconcileCoreImage } from '../../orient'
import type { ReconcileCoreItem, ReconcileImageItem } from '../../orient'
import { expectAngle } from './expect-angle'
import { syntheticHole } from './reconcile-synthetic'

const VERTICAL = { trend: 0, plunge: 90 }

// Sign check [derived by hand]. Vertical hole, trend 0 taken as the high side (holeFrame), so the
// bottom-of-hole line points south and beta runs clockwise looking down: S 0°, W 90°, N 180°,
// E 270°. A plane dipping 30° to 090 has its down-hole apex on the east side of the core:
// alpha = 90 − 30 = 60, beta = 270. Likewise 40/180 → alpha 50, beta 0 and 50/000 → alpha 40,
// beta 180. If the run's orientation line was marked 20° off so that the logger read 250, 340 and
// 160, the betas need +20° to agree with the image: rotation = +20 (image beta − logged beta).
const truePlanes = [
  { dipDirection: 90, dip: 30, alpha: 60, beta: 270 },
  { dipDirection: 180, dip: 40, alpha: 50, beta: 0 },
  { dipDirection: 0, dip: 50, alpha: 40, beta: 180 },
]

function handCase(reference: 'bottom' | 'top', offset: number) {
  const core: ReconcileCoreItem[] = truePlanes.map((p, i) => ({
    id: i + 1,
    depth: 10 + i,
    alpha: p.alpha,
    // Top of hole = bottom + 180 (betaFromBottom), so the top-referenced beta is 180 less.
    beta: (p.beta - (reference === 'top' ? 180 : 0) - offset + 720) % 360,
    reference,
    hole: VERTICAL,
    runId: 7,
  }))
  const image: ReconcileImageItem[] = truePlanes.map((p, i) => ({
    id: 101 + i,
    depth: 10 + i,
    plane: { dipDirection: p.dipDirection, dip: p.dip },
  }))
  return reconcileCoreImage(core, image, [
    { id: 7, fromDepth: 9.5, toDepth: 12.5, appliedRotation: 0 },
  ])
}

describe('reconcileCoreImage() sign of the rotation', () => {
  it('planeToCore() agrees with the hand derivation in a vertical hole [derived]', () => {
    for (const p of truePlanes) {
      const seen = planeToCore(p, VERTICAL)
      expectAngle(seen?.alpha, p.alpha, 1e-9)
      expectAngle(seen?.beta, p.beta, 1e-9)
    }
  })

  for (const reference of ['bottom', 'top'] as const)
    it(`reconcileCoreImage() betas logged 20° short (${reference} reference) → rotation +20, 'wrong' [derived]`, () => {
      const result = handCase(reference, 20)
      expect(result.depthShift).toBeCloseTo(0, 9)
      expect(result.matches.map((m) => [m.coreId, m.imageId])).toEqual([
        [1, 101],
        [2, 102],
        [3, 103],
      ])
      const [run] = result.runs
      expectAngle(run.rotation!, 20, 1e-6)
      expect(run.rotationError).toBeCloseTo(0, 6)
      expect(run.verdict).toBe('wrong')
      // With the applied rotation (0) the poles are 20° × sin(angle to the axis) apart or more;
      // after the estimated rotation they coincide.
      for (const m of result.matches) {
        expect(m.angle).toBeGreaterThan(5)
        expect(m.alignedAngle).toBeCloseTo(0, 6)
      }
    })

  it('reconcileCoreImage() betas logged 20° too far → rotation −20 [derived]', () => {
    expectAngle(handCase('bottom', -20).runs[0].rotation!, -20, 1e-6)
  })
})

describe('reconcileCoreImage() synthetic hole: 60 planes, 6 runs of 3 m, image 0.35 m deeper', () => {
  // Hole 120/60 curving gently; planes from 3 sets + 25 % random; Fisher kappa 300 about each true
  // pole on both sides; 2 cm depth noise on each side; run 4 logged against the top of hole.
  // Run 3 (index 2) logged 25° short: logged beta = true beta − 25, so the rotation to add is +25.
  const seeds = [1, 2, 3, 4, 5]
  const figures: string[] = []

  for (const seed of seeds)
    it(`reconcileCoreImage() seed ${seed}: shift 0.35 ± 0.05 m, bad run +25 ± 2° 'wrong', others 'ok'`, () => {
      const hole = syntheticHole({ seed, turned: { 2: 25 } })
      const result = reconcileCoreImage(hole.core, hole.image, hole.runs)
      expect(Math.abs(result.depthShift! - 0.35)).toBeLessThan(0.05)
      const bad = result.runs[2]
      expect(Math.abs(bad.rotation! - 25)).toBeLessThan(2)
      // The reported standard error is honest: the truth lies within three of them.
      expect(Math.abs(bad.rotation! - 25)).toBeLessThan(3 * bad.rotationError!)
      expect(bad.verdict).toBe('wrong')
      expect(bad.reason).toMatch(/exceeds 15°/)
      for (const run of result.runs.filter((_, k) => k !== 2)) {
        expect(run.verdict, run.reason).toBe('ok')
        expect(Math.abs(run.rotation!)).toBeLessThan(3 * run.rotationError! + 0.5)
      }
      expect(result.depthTrend).toBeNull()
      const correct = result.matches.filter((m) => m.imageId === m.coreId + 1000).length
      expect(correct).toBeGreaterThanOrEqual(57)
      figures.push(
        `seed ${seed}: shift error ${(result.depthShift! - 0.35).toFixed(4)} m, rotation error ` +
          `${(bad.rotation! - 25).toFixed(2)}° (± ${bad.rotationError!.toFixed(2)}°), ` +
          `${correct}/60 true pairs`,
      )
      if (figures.length === seeds.length) console.info(figures.join('\n'))
    })

  it("reconcileCoreImage() the same hole with 25° applied to the bad run → residual ≈ 0, 'ok'", () => {
    for (const seed of seeds) {
      const hole = syntheticHole({ seed, turned: { 2: 25 }, applied: { 2: 25 } })
      const result = reconcileCoreImage(hole.core, hole.image, hole.runs)
      const bad = result.runs[2]
      expect(bad.appliedRotation).toBe(25)
      expect(Math.abs(bad.rotation! - 25)).toBeLessThan(2)
      expect(Math.abs(bad.residual!)).toBeLessThan(2)
      expect(bad.verdict).toBe('ok')
      // What is stored now already agrees: angle and alignedAngle differ only by the estimate's
      // own error (a turn of δ moves a pole by at most δ).
      for (const m of result.matches.filter((m) => m.coreDepth >= 106 && m.coreDepth < 109))
        expect(Math.abs(m.angle - m.alignedAngle)).toBeLessThan(Math.abs(bad.residual!) + 1e-9)
    }
  })
})
