// Where the shift plot draws: each pair's depth difference (image − core) against its core depth,
// the estimated shift as a level line with its spread as a band, and the trend line when the
// server reports one. Plain numbers, so a test can check every coordinate.
import { extent, scaleLinear, type ScaleLinear } from 'd3'
import type { ReconciliationAnswer } from '../../../../schema/index'

export interface PlotBox {
  width: number
  height: number
  left: number
  right: number
  top: number
  bottom: number
}

export const shiftPlotBox: PlotBox = {
  width: 640,
  height: 230,
  left: 58,
  right: 14,
  top: 12,
  bottom: 34,
}

export interface ShiftPlot {
  x: ScaleLinear<number, number>
  y: ScaleLinear<number, number>
  points: { id: number; x: number; y: number; difference: number; coreDepth: number }[]
  /** The estimated shift as a level line, with its ± spread band; null without matches. */
  shift: { y: number; bandTop: number; bandBottom: number } | null
  trend: { x1: number; y1: number; x2: number; y2: number } | null
  /** The zero line, when zero lies within the plotted differences. */
  zeroY: number | null
  xTicks: { x: number; label: string }[]
  yTicks: { y: number; label: string }[]
}

/** Pads a range so a single value or a flat set still gets a readable axis. */
function padded([lo, hi]: [number, number], least: number): [number, number] {
  const span = Math.max(hi - lo, least)
  const middle = (lo + hi) / 2
  return [middle - span * 0.55, middle + span * 0.55]
}

/** Core-depth range of the plots: the runs' and the pairs' depths together. */
export function depthExtent(answer: ReconciliationAnswer): [number, number] {
  const depths = [
    ...answer.matches.map((m) => m.coreDepth),
    ...answer.runs.flatMap((r) => [r.fromDepth, r.toDepth]),
  ]
  const [lo, hi] = extent(depths)
  return lo === undefined || hi === undefined ? [0, 1] : [lo, hi]
}

/** The shared depth axis of the shift plot and the rotation strip. */
export function depthAxis(answer: ReconciliationAnswer, box: PlotBox) {
  return scaleLinear()
    .domain(padded(depthExtent(answer), 2))
    .range([box.left, box.width - box.right])
}

export function layoutShiftPlot(
  answer: ReconciliationAnswer,
  box: PlotBox = shiftPlotBox,
): ShiftPlot {
  const { matches, depthShift, depthShiftSpread, depthTrend } = answer
  const x = depthAxis(answer, box)
  const [d0, d1] = x.domain() as [number, number]
  const trendAt = (d: number) =>
    depthTrend ? depthTrend.intercept + depthTrend.slope * (d - depthTrend.referenceDepth) : 0
  // Zero is not forced into view: the scatter about the shift is what the plot is for.
  const values = matches.map((m) => m.depthDifference)
  if (depthShift !== null) values.push(depthShift - (depthShiftSpread ?? 0))
  if (depthShift !== null) values.push(depthShift + (depthShiftSpread ?? 0))
  if (depthTrend) values.push(trendAt(d0), trendAt(d1))
  const [v0, v1] = values.length
    ? padded([Math.min(...values), Math.max(...values)], 0.1)
    : padded([0, 0], 0.1)
  const y = scaleLinear()
    .domain([v0, v1])
    .range([box.height - box.bottom, box.top])
  const spread = depthShiftSpread ?? 0
  return {
    x,
    y,
    points: matches.map((m) => ({
      id: m.coreStructureId,
      x: x(m.coreDepth),
      y: y(m.depthDifference),
      difference: m.depthDifference,
      coreDepth: m.coreDepth,
    })),
    shift:
      depthShift === null
        ? null
        : { y: y(depthShift), bandTop: y(depthShift + spread), bandBottom: y(depthShift - spread) },
    trend: depthTrend ? { x1: x(d0), y1: y(trendAt(d0)), x2: x(d1), y2: y(trendAt(d1)) } : null,
    zeroY: v0 <= 0 && v1 >= 0 ? y(0) : null,
    xTicks: x.ticks(8).map((t) => ({ x: x(t), label: `${t}` })),
    yTicks: y.ticks(5).map((t) => ({ y: y(t), label: y.tickFormat(5, '+')(t) })),
  }
}
