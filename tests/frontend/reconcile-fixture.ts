import type { AdjustmentAnswer, ReconciliationAnswer } from '../../schema/index'

// An invented hole, GSQ-BH07, 39–48 m: three core runs, thirteen core–image pairs. The image logs
// every structure about 0.35 m deeper than the core, growing by 0.012 m per 10 m of hole; run 12's
// orientation line is off by about 25° (a wrong verdict), run 13 has too few pairs for one.
const shiftAt = (d: number) => 0.35 + 0.0012 * (d - 43.5)
/** Small alternating scatter (m), so the pairs are not on the line exactly. */
const scatter = [
  0.01, -0.012, 0.006, -0.004, 0.008, -0.009, 0.003, -0.002, 0.011, -0.01, 0.0, 0.005, -0.006,
]
const coreDepths = [39.4, 39.9, 40.6, 41.2, 41.8, 42.3, 42.9, 43.4, 43.8, 44.3, 44.8, 45.5, 46.7]

export const matches = coreDepths.map((coreDepth, i) => {
  const depthDifference = Number((shiftAt(coreDepth) + scatter[i]).toFixed(4))
  return {
    coreStructureId: 100 + i,
    imageStructureId: 200 + i,
    coreDepth,
    imageDepth: Number((coreDepth + depthDifference).toFixed(4)),
    depthDifference,
    angle: i >= 5 && i <= 10 ? 24 + (i % 3) : 4 + (i % 3),
    alignedAngle: 3 + (i % 3),
    score: 0.9 - i * 0.02,
  }
})

const mean = matches.reduce((s, m) => s + m.depthDifference, 0) / matches.length

export const adjustments: AdjustmentAnswer[] = [
  {
    id: 5,
    kind: 'depth-shift',
    runId: null,
    value: 0.3,
    previous: 0,
    reason: 'first look',
    basis: {},
    createdAt: '2026-03-02T09:00:00Z',
    createdBy: 'Erin Engineer',
    undoneAt: '2026-03-02T10:00:00Z',
    undoneBy: 'Lin Lead',
    active: false,
  },
  {
    id: 6,
    kind: 'run-rotation',
    runId: 11,
    value: 1.5,
    previous: 0,
    reason: '',
    basis: {},
    createdAt: '2026-03-03T09:00:00Z',
    createdBy: 'Erin Engineer',
    undoneAt: null,
    undoneBy: null,
    active: true,
  },
]

export function reconciliationAnswer(
  fields: Partial<ReconciliationAnswer> = {},
): ReconciliationAnswer {
  return {
    depthShift: mean,
    depthShiftSpread: 0.04,
    depthTrend: { slope: 0.0012, intercept: 0.35, referenceDepth: 43.5, slopeError: 0.0004 },
    appliedDepthShift: 0,
    matches,
    unmatchedCore: [{ id: 140, depth: 40.15, type: 'joint', dip: 62, dipDirection: 48 }],
    unmatchedImage: [
      { id: 240, depth: 43.05, type: 'vein', dip: 35, dipDirection: 301 },
      { id: 241, depth: 47.2, type: 'joint', dip: null, dipDirection: null },
    ],
    runs: [
      {
        runId: 11,
        fromDepth: 39,
        toDepth: 42,
        matched: 5,
        rotation: 1.8,
        rotationSpread: 2.1,
        rotationError: 0.9,
        appliedRotation: 1.5,
        residual: 3.2,
        verdict: 'ok',
        reason: '',
      },
      {
        runId: 12,
        fromDepth: 42,
        toDepth: 45,
        matched: 6,
        rotation: 24.6,
        rotationSpread: 3.4,
        rotationError: 1.4,
        appliedRotation: 0,
        residual: 22.9,
        verdict: 'wrong',
        reason: 'residual 22.9° is above 15°',
      },
      {
        runId: 13,
        fromDepth: 45,
        toDepth: 48,
        matched: 2,
        rotation: null,
        rotationSpread: null,
        rotationError: null,
        appliedRotation: 0,
        residual: null,
        verdict: null,
        reason: 'only 2 pairs; 3 needed',
      },
    ],
    adjustments,
    options: { depthWindow: 1, maxAngle: 20, okAngle: 5, wrongAngle: 15, minMatches: 3 },
    counts: { core: 14, image: 15 },
    ...fields,
  }
}
