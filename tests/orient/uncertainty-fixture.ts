import { uncertaintyColumns } from '../../orient'
import type { ErrorModel, Plane, UncertaintyColumns } from '../../orient'
import { vec } from './sample'

// Synthetic structures for the uncertainty tests, written by us, and small vector helpers kept
// apart from orient/ so the checks do not reuse the code under test.

export type Item =
  | {
      source: 'core'
      alpha: number
      beta: number
      hole: [number, number]
      rates?: [number, number]
      azimuthSd?: number
    }
  | {
      source: 'image'
      amplitude: number
      diameter: number
      trough: number
      north: boolean
      hole: [number, number]
      rates?: [number, number]
      azimuthSd?: number
    }
  | { source: 'true'; dip: number; dipDirection: number }

/** Columns holding the items in order (azimuthSd 1.5 unless given). */
export function columnsOf(items: readonly Item[]): UncertaintyColumns {
  const c = uncertaintyColumns(items.length)
  items.forEach((it, i) => {
    if (it.source === 'true') {
      c.source[i] = 1
      c.inputDip[i] = it.dip
      c.inputDipDirection[i] = it.dipDirection
      return
    }
    c.holeTrend[i] = it.hole[0]
    c.holePlunge[i] = it.hole[1]
    c.holeTrendRate[i] = it.rates?.[0] ?? 0
    c.holePlungeRate[i] = it.rates?.[1] ?? 0
    c.azimuthSd[i] = it.azimuthSd ?? 1.5
    if (it.source === 'core') {
      c.source[i] = 0
      c.alpha[i] = it.alpha
      c.beta[i] = it.beta
    } else {
      c.source[i] = 2
      c.amplitude[i] = it.amplitude
      c.diameter[i] = it.diameter
      c.trough[i] = it.trough
      c.north[i] = it.north ? 1 : 0
    }
  })
  return c
}

/** An error model with every 1σ zero except those given. */
export function onlyErrors(part: Partial<ErrorModel>): ErrorModel {
  return {
    surveyAzimuthSdMagnetic: 0,
    surveyAzimuthSdGyro: 0,
    surveyInclinationSd: 0,
    alphaSd: 0,
    betaSd: 0,
    pickHeightSdMm: 0,
    pickTroughSd: 0,
    trueDipSd: 0,
    trueDipDirectionSd: 0,
    depthSd: 0,
    ...part,
  }
}

export type V3 = [number, number, number]

/** Lower-hemisphere pole of a plane as a unit vector (east, north, up). */
export function poleVec(plane: Plane): V3 {
  return vec({ trend: plane.dipDirection + 180, plunge: 90 - plane.dip })
}

export const cross = (a: V3, b: V3): V3 => [
  a[1] * b[2] - a[2] * b[1],
  a[2] * b[0] - a[0] * b[2],
  a[0] * b[1] - a[1] * b[0],
]

/** Angle between two axes (degrees, 0–90). */
export function axisAngle(a: V3, b: V3): number {
  const c = Math.abs(a[0] * b[0] + a[1] * b[1] + a[2] * b[2])
  return (Math.acos(Math.min(1, c)) * 180) / Math.PI
}

/** Standard normals from a seeded uniform generator (Box & Muller 1958). */
export function normalSource(random: () => number): () => number {
  return () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random())
}

/** Nearest-rank 95th percentile (⌈0.95 N⌉-th smallest) by a full sort: the plain reference. */
export function percentile95(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b)
  return sorted[Math.ceil(0.95 * sorted.length) - 1]
}
