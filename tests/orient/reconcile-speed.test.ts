import { describe, expect, it } from 'vitest'
import { coreToPlane, planeToCore, reconcileCoreImage } from '../../orient'
import { syntheticHole } from './reconcile-synthetic'

// 5,000 planes on each side over 500 m (500 runs of 1 m, 10 planes a metre — densely fractured
// ground), one run turned by 25°. Synthetic, written by us.
const hole = syntheticHole({ seed: 99, runCount: 500, runLength: 1, perRun: 10, turned: { 7: 25 } })

function time(f: () => void): number {
  const t0 = performance.now()
  f()
  return performance.now() - t0
}

describe('reconcileCoreImage() cost', () => {
  it('reconcileCoreImage() 5,000 core × 5,000 image structures in well under a second', () => {
    expect(hole.core).toHaveLength(5000)
    expect(hole.image).toHaveLength(5000)
    // Baseline: one conversion of every structure (core → plane, image plane → core angles in the
    // core's hole): the least work any method comparing the two sides must do.
    let sink = 0
    const baseline = time(() => {
      for (const c of hole.core) sink += coreToPlane(c, c.hole, { reference: c.reference })!.dip
      hole.image.forEach((m, i) => (sink += planeToCore(m.plane, hole.core[i].hole)!.alpha))
    })
    let result = reconcileCoreImage([], [], [])
    const cold = time(() => (result = reconcileCoreImage(hole.core, hole.image, hole.runs)))
    const warm = Math.min(
      ...[0, 1, 2].map(() => time(() => reconcileCoreImage(hole.core, hole.image, hole.runs))),
    )
    console.info(
      `reconcile 5000×5000: cold ${cold.toFixed(0)} ms, warm ${warm.toFixed(0)} ms; baseline ` +
        `(one conversion per structure) ${baseline.toFixed(1)} ms; ratio warm/baseline ` +
        `${(warm / baseline).toFixed(0)}×`,
    )
    expect(sink).toBeGreaterThan(0)
    expect(cold).toBeLessThan(2000)
    expect(warm).toBeLessThan(2000)
    expect(result.matches.length).toBeGreaterThan(4900)
    expect(Math.abs(result.depthShift! - 0.35)).toBeLessThan(0.01)
    expect(result.runs[7].verdict).toBe('wrong')
  })
})
