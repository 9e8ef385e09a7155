// Where the rotation strip draws: per core run, a bar over its depth span at its estimated rotation
// with the ± spread as a band, and the rotation in force as a dashed line. Same depth axis as the
// shift plot, so the two read together.
import { scaleLinear, type ScaleLinear } from 'd3'
import type { ReconciliationAnswer } from '../../../../schema/index'
import { depthAxis, type PlotBox } from './shift-plot'

export const rotationStripBox: PlotBox = {
  width: 640,
  height: 170,
  left: 58,
  right: 14,
  top: 12,
  bottom: 34,
}

export interface StripRun {
  runId: number
  x: number
  width: number
  /** The estimate's bar and ± spread band; null without one (a hatched span on the zero line). */
  estimate: { y: number; bandTop: number; bandBottom: number } | null
  appliedY: number
  verdict: ReconciliationAnswer['runs'][number]['verdict']
}

export interface RotationStrip {
  x: ScaleLinear<number, number>
  y: ScaleLinear<number, number>
  runs: StripRun[]
  zeroY: number
  xTicks: { x: number; label: string }[]
  yTicks: { y: number; label: string }[]
}

export function layoutRotationStrip(
  answer: ReconciliationAnswer,
  box: PlotBox = rotationStripBox,
): RotationStrip {
  const x = depthAxis(answer, box)
  const values = [0]
  for (const r of answer.runs) {
    values.push(r.appliedRotation)
    if (r.rotation !== null) {
      const s = r.rotationSpread ?? 0
      values.push(r.rotation - s, r.rotation + s)
    }
  }
  const top = Math.max(...values)
  const bottom = Math.min(...values)
  const pad = Math.max((top - bottom) * 0.1, 2)
  const y = scaleLinear()
    .domain([bottom - pad, top + pad])
    .range([box.height - box.bottom, box.top])
  return {
    x,
    y,
    runs: answer.runs.map((r) => {
      const s = r.rotationSpread ?? 0
      return {
        runId: r.runId,
        x: x(r.fromDepth),
        width: Math.max(1, x(r.toDepth) - x(r.fromDepth)),
        estimate:
          r.rotation === null
            ? null
            : { y: y(r.rotation), bandTop: y(r.rotation + s), bandBottom: y(r.rotation - s) },
        appliedY: y(r.appliedRotation),
        verdict: r.verdict,
      }
    }),
    zeroY: y(0),
    xTicks: x.ticks(8).map((t) => ({ x: x(t), label: `${t}` })),
    yTicks: y.ticks(5).map((t) => ({ y: y(t), label: `${y.tickFormat(5, '+~f')(t)}°` })),
  }
}
