import { finite } from './math'
import { planarVerdict, topplingVerdict, wedgeVerdict } from './kinematic-rules'
import type { KinematicSettings, Verdict, WedgeVerdict } from './kinematic-rules'
import type { Plane } from './types'

/** Indices of two planes whose intersection is checked for wedge sliding. */
export type WedgePair = readonly [number, number]

export interface PlaneVerdict extends Verdict {
  readonly index: number
}

export interface PairVerdict extends WedgeVerdict {
  readonly a: number
  readonly b: number
}

export interface KinematicResult {
  readonly planar: PlaneVerdict[]
  readonly wedge: PairVerdict[]
  readonly toppling: PlaneVerdict[]
  /** Share of items possible per mode, percent (0 when there is nothing to check). */
  readonly percent: { readonly planar: number; readonly wedge: number; readonly toppling: number }
}

const invalid = 'invalid orientation'

/**
 * Kinematic screening of planes against a slope face (Markland 1972; Hoek & Bray 1981; Wyllie &
 * Mah 2004; Goodman & Bray 1976): planar sliding and flexural toppling per plane, wedge sliding per
 * pair of planes (all pairs by default — O(n²): pass set means or chosen pairs for large data).
 * Each verdict carries a reason; a screening, not a stability analysis. Undefined for an invalid
 * face (dip outside 0–90), friction (outside 0–90) or lateral limit (outside 0–180).
 */
export function kinematicChecks(
  settings: KinematicSettings,
  planes: readonly Plane[],
  pairs?: readonly WedgePair[],
): KinematicResult | undefined {
  const { face, friction } = settings
  if (!finite(face.dipDirection, face.dip, friction)) return undefined
  if (face.dip <= 0 || face.dip > 90 || friction < 0 || friction >= 90) return undefined
  const limits = [settings.lateralLimit ?? 20, settings.topplingLimit ?? 30]
  if (!limits.every((l) => l >= 0 && l <= 180)) return undefined
  const ok = (p: Plane | undefined): p is Plane =>
    !!p && finite(p.dipDirection, p.dip) && p.dip >= 0 && p.dip <= 90
  const planar = planes.map((p, index) => ({
    index,
    ...(ok(p) ? planarVerdict(p, settings) : { possible: false, reason: invalid }),
  }))
  const toppling = planes.map((p, index) => ({
    index,
    ...(ok(p) ? topplingVerdict(p, settings) : { possible: false, reason: invalid }),
  }))
  const list: WedgePair[] = pairs ? [...pairs] : []
  if (!pairs)
    for (let a = 0; a < planes.length; a++)
      for (let b = a + 1; b < planes.length; b++) list.push([a, b])
  const wedge = list.map(([a, b]) => {
    const pa = planes[a]
    const pb = planes[b]
    if (a === b || !ok(pa) || !ok(pb))
      return { a, b, possible: false, reason: invalid, line: undefined, slidesOn: undefined }
    return { a, b, ...wedgeVerdict(pa, pb, settings) }
  })
  const share = (v: readonly Verdict[]) =>
    v.length === 0 ? 0 : (100 * v.filter((x) => x.possible).length) / v.length
  return {
    planar,
    wedge,
    toppling,
    percent: { planar: share(planar), wedge: share(wedge), toppling: share(toppling) },
  }
}
