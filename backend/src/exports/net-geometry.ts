import {
  greatCircle,
  project,
  smallCircle,
  type Line,
  type NetPoint,
  type NetProjection,
} from '../../../orient/index'
import { setColour } from '../../../schema/vocabulary'
import type { Analysis } from './pack-types'

/** One interval's net in unit-radius coordinates (x east, y north), from orient's projection. */
export interface NetFigure {
  poles: { point: NetPoint; setIndex: number }[]
  circles: { setIndex: number; points: NetPoint[] }[]
  /** Sampling (Fisher alpha95) and combined (alpha95 with the shared survey error) cones. */
  cones: { setIndex: number; kind: 'sampling' | 'combined'; points: NetPoint[] }[]
  intersections: { point: NetPoint; label: string }[]
  setNames: string[]
}

const projected = (lines: Line[] | undefined, projection: NetProjection) =>
  (lines ?? []).map((l) => project(l, projection)).filter((p): p is NetPoint => p !== undefined)

/**
 * Poles coloured by set, each set's mean great circle, its alpha95 cone and its combined cone
 * (alpha95 with the survey error the hole's structures share) about the mean pole,
 * and the set-pair intersections.
 */
export function netFigure(analysis: Analysis, projection: NetProjection): NetFigure {
  const setIndex = new Map(analysis.sets.map((s, i) => [s.id, i]))
  const poles = analysis.structures
    .filter((s) => s.poleTrend !== null && s.polePlunge !== null)
    .map((s) => ({
      point: project({ trend: s.poleTrend!, plunge: s.polePlunge! }, projection)!,
      setIndex: s.setId === null ? -1 : (setIndex.get(s.setId) ?? -1),
    }))
    .filter((p) => p.point !== undefined)
  const circles = analysis.sets.flatMap((s, i) =>
    s.mean ? [{ setIndex: i, points: projected(greatCircle(s.mean, 90), projection) }] : [],
  )
  const cone = (
    i: number,
    pole: Line | null,
    angle: number | null,
    kind: 'sampling' | 'combined',
  ) =>
    pole && angle
      ? (smallCircle(pole, angle, 90) ?? []).map((arc) => ({
          setIndex: i,
          kind,
          points: projected(arc, projection),
        }))
      : []
  const cones = analysis.sets.flatMap((s, i) => [
    ...cone(i, s.meanPole, s.alpha95, 'sampling'),
    ...(s.uncertainty95 && s.uncertainty95 > (s.alpha95 ?? 0)
      ? cone(i, s.meanPole, s.uncertainty95, 'combined')
      : []),
  ])
  const intersections = analysis.intersections.flatMap((x) => {
    if (x.trend === null || x.plunge === null) return []
    const point = project({ trend: x.trend, plunge: x.plunge }, projection)
    return point ? [{ point, label: `${x.nameA}/${x.nameB}` }] : []
  })
  return { poles, circles, cones, intersections, setNames: analysis.sets.map((s) => s.name) }
}

/** The screen's set colours (one palette in schema/vocabulary.ts), so a pack's set 1 is the screen's. */
export const colourOf = setColour
