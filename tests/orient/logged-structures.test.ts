import { describe, expect, it } from 'vitest'
import {
  computeStructures,
  storedInputs,
  TERZAGHI_CAP,
  terzaghiWeightOfAlpha,
  type ComputeContext,
  type StoredStructure,
  type StructureInputs,
} from '../../orient'

/** A straight hole along trend/plunge, surveyed at its collar and at 100 m, one good run. */
function straightHole(trend: number, plunge: number): ComputeContext {
  return {
    steepThresholdDeg: 85,
    betaJumpDeg: 60,
    referenceLine: 'bottom',
    collar: { east: 0, north: 0, elevation: 0 },
    planned: { trend, plunge },
    stations: [
      { depth: 0, azimuth: trend, plunge },
      { depth: 100, azimuth: trend, plunge },
    ],
    runs: [{ fromDepth: 0, toDepth: 100, markConfidence: 'good' }],
  }
}

const core = (alpha: number, beta?: number): StructureInputs => ({
  depth: 10,
  type: 'joint',
  source: 'core',
  alpha,
  beta: beta ?? null,
})
const truePlane = (dip: number, dipDirection: number): StructureInputs => ({
  depth: 10,
  type: 'joint',
  source: 'true',
  inputDip: dip,
  inputDipDirection: dipDirection,
})

type Line = { trend: number; plunge: number }
/** East, north, down of a line (plunge positive down), written out here apart from orient. */
const xyz = ({ trend, plunge }: Line) => {
  const [t, p] = [(trend * Math.PI) / 180, (plunge * Math.PI) / 180]
  return [Math.sin(t) * Math.cos(p), Math.cos(t) * Math.cos(p), Math.sin(p)]
}
/** Terzaghi (1965): w = 1/|cos δ|, δ the angle between the hole axis and the plane's pole. */
function terzaghiFormula(pole: Line, hole: Line): number {
  const [a, b] = [xyz(pole), xyz(hole)]
  return 1 / Math.abs(a[0] * b[0] + a[1] * b[1] + a[2] * b[2])
}

describe('computeStructures() Terzaghi weight', () => {
  it('computeStructures() true planes in borehole 136/55 → 2.066, 2.338, 3.645, 1.866, 1.340, 1.183 (Harrison & Hudson 2000, Q/A 7.10)', () => {
    // [pub] Harrison & Hudson (2000), Engineering Rock Mechanics part 2, Q/A 7.10: six fractures
    // (dip/dip direction) sampled by a borehole 136/55, weighted after Terzaghi (1965).
    const planes = [
      [39, 201],
      [50, 213],
      [63, 215],
      [52, 230],
      [42, 247],
      [28, 253],
    ]
    const out = computeStructures(
      straightHole(136, 55),
      planes.map(([dip, dd]) => truePlane(dip, dd)),
    )
    const published = [2.066, 2.338, 3.645, 1.866, 1.34, 1.183]
    out.forEach((c, i) => {
      expect(c.terzaghiWeight!).toBeCloseTo(published[i], 3)
      expect(c.flags).not.toContain('blind-zone')
    })
  })

  it('computeStructures() oriented core in hole 000/60: the stored weight is 1/|cos δ| of its own pole (Terzaghi 1965)', () => {
    // [pub] Terzaghi (1965), Géotechnique 15:287, w = 1/|cos δ|; on core δ = 90° − alpha, so the
    // weight from alpha alone must equal the formula applied to the computed pole and hole axis.
    const ctx = straightHole(0, 60)
    const items = [core(60, 90), core(35, 210), core(20, 0), core(80, 300)]
    computeStructures(ctx, items).forEach((c, i) => {
      const pole = { trend: c.poleTrend!, plunge: c.polePlunge! }
      const hole = { trend: c.holeTrend!, plunge: c.holePlunge! }
      expect(c.terzaghiWeight!).toBeCloseTo(terzaghiFormula(pole, hole), 9)
      expect(c.terzaghiWeight!).toBeCloseTo(1 / Math.sin((items[i].alpha! * Math.PI) / 180), 12)
    })
  })

  it('computeStructures() core and the same plane given as true orientation weigh alike: alpha 60, beta 90 in 000/60 is 41.41/229.11 (Marjoribanks 2010, App. D)', () => {
    // [derived] The plane 41.41/229.11 of core.test.ts, cross-checked against Marjoribanks (2010,
    // Geological Methods in Mineral Exploration and Mining, App. D); w = 1/sin 60° = 1.1547.
    const [fromCore, fromTrue] = computeStructures(straightHole(0, 60), [
      core(60, 90),
      truePlane(41.41, 229.11),
    ])
    expect(fromCore.terzaghiWeight!).toBeCloseTo(1.1547, 4)
    expect(fromTrue.terzaghiWeight!).toBeCloseTo(1.1547, 3)
  })

  it('computeStructures() unoriented core (no beta) is weighted from alpha alone: alpha 30 → 2', () => {
    const [c] = computeStructures(straightHole(0, 60), [core(30)])
    expect(c.terzaghiWeight).toBeCloseTo(2, 12)
    expect(c.dip).toBeNull()
    expect(c.flags).toContain('unoriented')
  })

  it('computeStructures() caps the weight at 10 in the blind zone and flags it (cap after Priest 1993, from memory)', () => {
    // [memory] Cap 10, i.e. |cos δ| ≥ 0.1, after Priest (1993), Discontinuity Analysis for Rock
    // Engineering. sin 4° = 0.0698 < 0.1 → capped; sin 6° = 0.1045 → 1/0.1045 = 9.567.
    const [steep, justOut, parallel] = computeStructures(straightHole(0, 90), [
      core(4, 0),
      core(6, 0),
      truePlane(90, 45),
    ])
    expect(TERZAGHI_CAP).toBe(10)
    expect(steep.terzaghiWeight).toBe(10)
    expect(steep.flags).toContain('blind-zone')
    expect(justOut.terzaghiWeight).toBeCloseTo(9.567, 3)
    expect(justOut.flags).not.toContain('blind-zone')
    // A vertical plane in a vertical hole has its pole across the axis: cos δ = 0.
    expect(parallel.terzaghiWeight).toBe(10)
    expect(parallel.flags).toContain('blind-zone')
  })
})

describe('terzaghiWeightOfAlpha()', () => {
  it('terzaghiWeightOfAlpha() 1/sin(alpha) with the cap; a larger cap lifts it; NaN or cap < 1 → undefined', () => {
    expect(terzaghiWeightOfAlpha(90)).toBe(1)
    expect(terzaghiWeightOfAlpha(30)).toBeCloseTo(2, 12)
    expect(terzaghiWeightOfAlpha(2)).toBe(10)
    expect(terzaghiWeightOfAlpha(2, 100)).toBeCloseTo(1 / Math.sin((2 * Math.PI) / 180), 9)
    expect(terzaghiWeightOfAlpha(NaN)).toBeUndefined()
    expect(terzaghiWeightOfAlpha(30, 0.5)).toBeUndefined()
  })
})

describe('storedInputs()', () => {
  const row: StoredStructure = {
    depth: 12,
    type: 'joint',
    source: 'image',
    alpha: null,
    beta: null,
    referenceLine: null,
    inputDip: null,
    inputDipDirection: null,
    pickAmplitude: 40,
    pickDiameter: 96,
    pickTroughAzimuth: 210,
    pickReference: 'north',
  }

  it('storedInputs() an image row → its raw pick, north kept, any other reference the high side', () => {
    expect(storedInputs(row).pick).toEqual({
      amplitude: 40,
      diameter: 96,
      troughAzimuth: 210,
      reference: 'north',
    })
    expect(storedInputs({ ...row, pickReference: 'highside' }).pick?.reference).toBe('highside')
    expect(storedInputs({ ...row, pickReference: null }).pick?.reference).toBe('highside')
  })

  it('storedInputs() a pick missing a value, or a core row, carries no pick', () => {
    expect(storedInputs({ ...row, pickDiameter: null }).pick).toBeNull()
    const coreRow = { ...row, source: 'core' as const, alpha: 50, beta: 120 }
    expect(storedInputs(coreRow)).toMatchObject({
      source: 'core',
      alpha: 50,
      beta: 120,
      pick: null,
    })
  })
})
