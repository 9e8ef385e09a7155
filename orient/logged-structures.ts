import { coreToPlane } from './core'
import { poleOf } from './planes'
import { prepareSurvey } from './survey-interpolate'
import { TERZAGHI_CAP, terzaghiWeight, terzaghiWeightOfAlpha } from './terzaghi'
import { imagePickToPlane, type ImagePick } from './image-pick'
import type { Line, Plane } from './types'
import type { ErrorModel } from './error-model'
import { structureUncertainty } from './logged-uncertainty'

/**
 * A logged structure's computed values and quality flags, as the server stores them and the entry
 * grid previews them while the logger types: one code for both.
 */

/** Why a computed orientation deserves a second look; shown beside the value, never instead of it. */
export const structureFlags = [
  'no-survey', // no survey stations: the planned direction was used
  'beyond-survey', // deeper than the last station: its direction was held
  'steep-hole', // hole steeper than the project threshold: bottom-of-hole marks unreliable
  'outside-run', // no core run covers this depth
  'poor-mark', // the run's orientation mark is poor
  'unoriented', // no usable orientation mark (or no beta): alpha only, no dip direction
  'blind-zone', // sub-parallel to the hole: Terzaghi weight capped
  'beta-jump', // beta far from the previous structure of the same type in the run
  'pick-size', // image pick: sinusoid too tall for the hole (relative dip ≥ 85°) or diameter off the hole's
] as const
export type StructureFlag = (typeof structureFlags)[number]

export interface ComputeContext {
  steepThresholdDeg: number
  betaJumpDeg: number
  referenceLine: 'bottom' | 'top'
  collar: { east: number; north: number; elevation: number }
  planned: Line
  stations: readonly {
    depth: number
    azimuth: number
    plunge: number
    declinationApplied?: number
    /** The survey method as recorded (a gyroscopic tool has its own azimuth error). */
    method?: string
  }[]
  /** Sorted by fromDepth. */
  /** Nominal hole diameter (same unit as image-pick diameters), when known. */
  holeDiameter?: number
  runs: readonly {
    fromDepth: number
    toDepth: number
    markConfidence: 'good' | 'fair' | 'poor' | 'none'
    /** Orientation-line rotation in force (degrees added to the run's logged betas), 0 or absent. */
    betaRotation?: number
  }[]
  /** With an error model, each structure gets its Monte Carlo 95 % cone (logged-uncertainty.ts). */
  errorModel?: ErrorModel
}

export interface StructureInputs {
  depth: number
  type: string
  source: 'core' | 'true' | 'image'
  alpha?: number | null
  beta?: number | null
  referenceLine?: 'bottom' | 'top' | null
  inputDip?: number | null
  inputDipDirection?: number | null
  /** Image pick, raw (trough azimuth already referred to true north when north-referenced). */
  pick?: ImagePick | null
}

export interface StructureComputed {
  dip: number | null
  dipDirection: number | null
  poleTrend: number | null
  polePlunge: number | null
  holeTrend: number | null
  holePlunge: number | null
  east: number | null
  north: number | null
  elevation: number | null
  terzaghiWeight: number | null
  declinationApplied: number | null
  flags: StructureFlag[]
  /** Run rotation added to the logged beta (core structures in a run), else null. */
  betaRotationApplied: number | null
  /** 95 % cone half-angle about the pole (degrees) and its ellipse; null without an error model or pole. */
  uncertainty95: number | null
  uncertaintyMajor: number | null
  uncertaintyMinor: number | null
  uncertaintyAxisTrend: number | null
  uncertaintyAxisPlunge: number | null
  uncertaintyReasons: string[]
}

/** Above this relative dip a sinusoid's height exceeds about 11 hole diameters: not a reliable pick. */
const MAX_PICK_RELATIVE_DIP = 85

function runAt(runs: ComputeContext['runs'], depth: number) {
  let lo = 0
  let hi = runs.length - 1
  while (lo <= hi) {
    const mid = (lo + hi) >> 1
    const r = runs[mid]
    if (depth < r.fromDepth) hi = mid - 1
    else if (depth >= r.toDepth) lo = mid + 1
    else return { run: r, index: mid }
  }
  return undefined
}

const betaGap = (a: number, b: number) => {
  const d = Math.abs(a - b) % 360
  return d > 180 ? 360 - d : d
}

/**
 * True orientation, pole, position, Terzaghi weight and flags of a hole's structures, sorted by
 * depth (beta jumps compare each with the previous one of the same type in the same run).
 */
export function computeStructures(
  ctx: ComputeContext,
  items: readonly StructureInputs[],
): StructureComputed[] {
  const lastStation = ctx.stations.length ? ctx.stations[ctx.stations.length - 1].depth : -Infinity
  const survey = prepareSurvey(ctx.stations)
  const previousBeta = new Map<string, number>()
  const out = items.map((s): StructureComputed => {
    const flags: StructureFlag[] = []
    let hole: Line = ctx.planned
    if (ctx.stations.length === 0) flags.push('no-survey')
    else {
      hole = survey.holeAt(s.depth) ?? ctx.planned
      if (s.depth > lastStation) flags.push('beyond-survey')
    }
    if (Math.abs(hole.plunge) >= ctx.steepThresholdDeg) flags.push('steep-hole')
    const found = runAt(ctx.runs, s.depth)
    let plane: Plane | undefined
    let weight: number | undefined
    let rotation: number | null = null
    if (s.source === 'core') {
      if (!found) flags.push('outside-run')
      else if (found.run.markConfidence === 'poor') flags.push('poor-mark')
      const oriented = s.beta != null && found?.run.markConfidence !== 'none'
      const alpha = s.alpha ?? 0
      if (oriented) {
        rotation = found?.run.betaRotation ?? 0
        plane = coreToPlane({ alpha, beta: s.beta! + rotation }, hole, {
          reference: s.referenceLine ?? ctx.referenceLine,
        })
        if (found) {
          const key = `${s.type}@${found.index}`
          const before = previousBeta.get(key)
          if (before !== undefined && betaGap(before, s.beta!) > ctx.betaJumpDeg)
            flags.push('beta-jump')
          previousBeta.set(key, s.beta!)
        }
      } else flags.push('unoriented')
      weight = terzaghiWeightOfAlpha(alpha, TERZAGHI_CAP)
    } else if (s.source === 'true') {
      plane = { dip: s.inputDip ?? 0, dipDirection: s.inputDipDirection ?? 0 }
    } else if (s.pick) {
      plane = imagePickToPlane(s.pick, hole)
      const relativeDip = Math.atan2(s.pick.amplitude, s.pick.diameter) * (180 / Math.PI)
      const sizeOff = ctx.holeDiameter
        ? Math.abs(s.pick.diameter / ctx.holeDiameter - 1) > 0.25
        : false
      if (relativeDip >= MAX_PICK_RELATIVE_DIP || sizeOff) flags.push('pick-size')
    }
    if (plane && s.source !== 'core') weight = terzaghiWeight(plane, hole, TERZAGHI_CAP)
    if (weight !== undefined && weight >= TERZAGHI_CAP) flags.push('blind-zone')
    const pole = plane ? poleOf(plane) : undefined
    const at = ctx.stations.length
      ? survey.positionAt(s.depth)
      : plannedOffset(ctx.planned, s.depth)
    return {
      dip: plane?.dip ?? null,
      dipDirection: plane?.dipDirection ?? null,
      poleTrend: pole?.trend ?? null,
      polePlunge: pole?.plunge ?? null,
      holeTrend: hole.trend,
      holePlunge: hole.plunge,
      east: at ? ctx.collar.east + at.east : null,
      north: at ? ctx.collar.north + at.north : null,
      elevation: at ? ctx.collar.elevation - at.down : null,
      terzaghiWeight: weight ?? null,
      declinationApplied: declinationAt(ctx.stations, s.depth),
      flags,
      betaRotationApplied: rotation,
      uncertainty95: null,
      uncertaintyMajor: null,
      uncertaintyMinor: null,
      uncertaintyAxisTrend: null,
      uncertaintyAxisPlunge: null,
      uncertaintyReasons: [],
    }
  })
  if (ctx.errorModel) structureUncertainty(ctx, ctx.errorModel, items, out, survey)
  return out
}

/** A straight hole along its planned direction, when there is no survey yet. */
function plannedOffset(planned: Line, depth: number) {
  const t = (planned.trend * Math.PI) / 180
  const p = (planned.plunge * Math.PI) / 180
  return {
    east: depth * Math.sin(t) * Math.cos(p),
    north: depth * Math.cos(t) * Math.cos(p),
    down: depth * Math.sin(p),
  }
}

/** Declination applied to the station at or above the depth (the survey carries it). */
function declinationAt(stations: ComputeContext['stations'], depth: number): number | null {
  let value: number | null = stations.length ? (stations[0].declinationApplied ?? 0) : null
  for (const s of stations) {
    if (s.depth > depth) break
    value = s.declinationApplied ?? 0
  }
  return value
}

/** A structure as stored (database columns in camelCase), whatever its source. */
export interface StoredStructure {
  depth: number
  type: string
  source: 'core' | 'true' | 'image'
  alpha: number | null
  beta: number | null
  referenceLine: 'bottom' | 'top' | null
  inputDip: number | null
  inputDipDirection: number | null
  pickAmplitude: number | null
  pickDiameter: number | null
  pickTroughAzimuth: number | null
  pickReference: string | null
}

/** The inputs computeStructures needs from a stored structure (server recompute and browser alike). */
export function storedInputs(s: StoredStructure): StructureInputs {
  const pick =
    s.source === 'image' &&
    s.pickAmplitude !== null &&
    s.pickDiameter !== null &&
    s.pickTroughAzimuth !== null
      ? {
          amplitude: s.pickAmplitude,
          diameter: s.pickDiameter,
          troughAzimuth: s.pickTroughAzimuth,
          reference: s.pickReference === 'north' ? ('north' as const) : ('highside' as const),
        }
      : null
  return {
    depth: s.depth,
    type: s.type,
    source: s.source,
    alpha: s.alpha,
    beta: s.beta,
    referenceLine: s.referenceLine,
    inputDip: s.inputDip,
    inputDipDirection: s.inputDipDirection,
    pick,
  }
}
