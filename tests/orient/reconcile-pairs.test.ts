import { describe, expect, it } from 'vitest'
import { RECONCILE_DEFAULTS, reconcileCoreImage } from '../../orient'
import type { ReconcileCoreItem, ReconcileImageItem } from '../../orient'
import { holeAt, syntheticHole } from './reconcile-synthetic'
import { seeded } from './sample'

describe('reconcileCoreImage() pairing and bookkeeping', () => {
  it('reconcileCoreImage() structures on one side only → listed unmatched, true pairs kept', () => {
    const hole = syntheticHole({ seed: 7 })
    // The image log starts 5 m above the cored interval; a 7th run (118–121 m) has no image.
    const imageOnly: ReconcileImageItem[] = [95.2, 96.1, 97.4, 98.0].map((depth, i) => ({
      id: 5001 + i,
      depth,
      plane: { dipDirection: 40 * i, dip: 20 + 15 * i },
    }))
    const coreOnly: ReconcileCoreItem[] = [118.4, 119.3, 120.6].map((depth, i) => ({
      id: 501 + i,
      depth,
      alpha: 30 + 20 * i,
      beta: 100 * i,
      reference: 'bottom',
      hole: holeAt(depth),
      runId: 199,
    }))
    const runs = [...hole.runs, { id: 199, fromDepth: 118, toDepth: 121, appliedRotation: 0 }]
    const result = reconcileCoreImage(
      [...hole.core, ...coreOnly],
      [...imageOnly, ...hole.image],
      runs,
    )
    expect(result.unmatchedCore).toEqual([501, 502, 503])
    expect(result.unmatchedImage).toEqual([5001, 5002, 5003, 5004])
    expect(result.matches).toHaveLength(60)
    const lastRun = result.runs.at(-1)!
    expect(lastRun).toMatchObject({ runId: 199, matched: 0, rotation: null, verdict: null })
    expect(lastRun.reason).toBe('No structure in this run was matched.')
  })

  it('reconcileCoreImage() one to one: a look-alike decoy beside every image structure is never used twice', () => {
    const hole = syntheticHole({ seed: 8 })
    const decoys = hole.image.map((m) => ({ ...m, id: m.id + 10_000, depth: m.depth + 0.3 }))
    const result = reconcileCoreImage(hole.core, [...hole.image, ...decoys], hole.runs)
    const imageIds = result.matches.map((m) => m.imageId)
    const coreIds = result.matches.map((m) => m.coreId)
    expect(new Set(imageIds).size).toBe(imageIds.length)
    expect(new Set(coreIds).size).toBe(coreIds.length)
    expect(result.matches.length + result.unmatchedCore.length).toBe(60)
    expect(result.matches.length + result.unmatchedImage.length).toBe(120)
    // The decoy sits 0.3 m off the shift; the true partner wins nearly always.
    const correct = result.matches.filter((m) => m.imageId === m.coreId + 1000).length
    expect(correct).toBeGreaterThanOrEqual(54)
    expect(Math.abs(result.depthShift! - 0.35)).toBeLessThan(0.05)
  })

  it('reconcileCoreImage() 60 extra random image picks (the image sees more) → same verdicts', () => {
    for (const seed of [1, 2, 3, 4, 5]) {
      const hole = syntheticHole({ seed, turned: { 2: 25 } })
      const random = seeded(seed + 500)
      const extra: ReconcileImageItem[] = Array.from({ length: 60 }, (_, i) => ({
        id: 20_000 + i,
        depth: 100 + 18 * random(),
        plane: { dipDirection: 360 * random(), dip: (Math.acos(random()) * 180) / Math.PI },
      }))
      const result = reconcileCoreImage(hole.core, [...hole.image, ...extra], hole.runs)
      expect(Math.abs(result.depthShift! - 0.35)).toBeLessThan(0.05)
      expect(result.runs.map((r) => r.verdict)).toEqual(['ok', 'ok', 'wrong', 'ok', 'ok', 'ok'])
      expect(Math.abs(result.runs[2].rotation! - 25)).toBeLessThan(
        3 * result.runs[2].rotationError!,
      )
      expect(result.unmatchedImage.length).toBeGreaterThanOrEqual(60)
    }
  })

  it('reconcileCoreImage() a run with 2 matches (minMatches 3) → verdict null, reason says so', () => {
    const hole = syntheticHole({ seed: 9 })
    // Keep only two structures of run 2 (103–106 m) on the image side.
    const keep = hole.core.filter((c) => c.runId === 101).slice(0, 2)
    const image = hole.image.filter(
      (m) => m.id - 1000 > 20 || m.id - 1000 <= 10 || keep.some((c) => c.id === m.id - 1000),
    )
    const result = reconcileCoreImage(hole.core, image, hole.runs)
    const run = result.runs[1]
    expect(run.matched).toBe(2)
    expect(run.verdict).toBeNull()
    expect(run.reason).toBe('Only 2 matches, fewer than the 3 needed for a verdict.')
    // Two matches still give a rotation with its spread, shown but not judged.
    expect(run.rotation).not.toBeNull()
    const strict = reconcileCoreImage(hole.core, hole.image, hole.runs, { minMatches: 11 })
    expect(strict.runs.every((r) => r.verdict === null)).toBe(true)
    expect(strict.options).toEqual({ ...RECONCILE_DEFAULTS, minMatches: 11 })
  })

  it('reconcileCoreImage() a residual between okAngle and wrongAngle → suspect', () => {
    const hole = syntheticHole({ seed: 10, turned: { 1: 10 }, kappa: 3000 })
    const run = reconcileCoreImage(hole.core, hole.image, hole.runs).runs[1]
    expect(Math.abs(run.rotation! - 10)).toBeLessThan(2)
    expect(run.verdict).toBe('suspect')
    expect(run.reason).toMatch(/^Residual \+\d+\.\d° from \d+ matches is between 5° and 15°\.$/)
  })

  it('reconcileCoreImage() invalid items (alpha 95, NaN depth) are unmatched, never thrown on', () => {
    const hole = syntheticHole({ seed: 11 })
    const bad: ReconcileCoreItem = { ...hole.core[0], id: 900, alpha: 95 }
    const badImage: ReconcileImageItem = { ...hole.image[0], id: 9000, depth: NaN }
    const result = reconcileCoreImage([...hole.core, bad], [...hole.image, badImage], hole.runs)
    expect(result.unmatchedCore).toContain(900)
    expect(result.unmatchedImage).toContain(9000)
    expect(result.matches.length).toBeGreaterThanOrEqual(57)
  })

  it('reconcileCoreImage() no image structures → shift null, every run null with its reason', () => {
    const hole = syntheticHole({ seed: 12 })
    const result = reconcileCoreImage(hole.core, [], hole.runs)
    expect(result).toMatchObject({
      depthShift: null,
      depthShiftSpread: null,
      depthTrend: null,
      matches: [],
      unmatchedImage: [],
    })
    expect(result.unmatchedCore).toHaveLength(60)
    expect(result.runs.map((r) => r.runId)).toEqual([100, 101, 102, 103, 104, 105])
    expect(result.runs.every((r) => r.verdict === null && r.matched === 0)).toBe(true)
  })

  it('reconcileCoreImage() cores outside runs still pair and set the shift; runs come in depth order', () => {
    const hole = syntheticHole({ seed: 13 })
    const loose = hole.core.map((c) => ({ ...c, runId: null }))
    const reversed = [...hole.runs].reverse()
    const result = reconcileCoreImage(loose, hole.image, reversed)
    expect(Math.abs(result.depthShift! - 0.35)).toBeLessThan(0.05)
    expect(result.matches.length).toBeGreaterThanOrEqual(57)
    expect(result.runs.map((r) => r.fromDepth)).toEqual([100, 103, 106, 109, 112, 115])
    expect(result.runs.every((r) => r.matched === 0)).toBe(true)
  })

  it('reconcileCoreImage() scores lie in (0, 1] and alignedAngle ≤ maxAngle', () => {
    const hole = syntheticHole({ seed: 14, turned: { 4: -40 } })
    const result = reconcileCoreImage(hole.core, hole.image, hole.runs, { maxAngle: 15 })
    expect(Math.abs(result.runs[4].rotation! + 40)).toBeLessThan(3)
    for (const m of result.matches) {
      expect(m.score).toBeGreaterThan(0)
      expect(m.score).toBeLessThanOrEqual(1)
      expect(m.alignedAngle).toBeLessThanOrEqual(15 + 1e-9)
      expect(m.depthDifference).toBeCloseTo(m.imageDepth - m.coreDepth, 12)
    }
  })
})
