import { DEG2RAD } from './math'
import { betaFromBottom, corePole, validCoreInput } from './core'
import { holeFrame } from './hole-frame'
import { combine, cross, vecToLine } from './vector'
import type { CoreLineAngles, CoreOptions, Line } from './types'

/**
 * Lineation on a structure measured on oriented core, gamma convention (a): gamma is the angle
 * within the plane from the ellipse long axis to the lineation. It is measured from the down-hole
 * end of the long axis (the beta apex), clockwise as seen looking down-hole through the plane
 * (viewer on the up-hole side, looking along the down-hole pole) — the same sense as beta. A
 * lineation is an axis: gamma and gamma + 180 give the same line.
 *
 * Convention (b) of Marjoribanks (2010, App. D.2), an angle to the core axis paired with a
 * circumferential angle, is not this one. Returns the lower-hemisphere line, or undefined for
 * non-finite input or alpha outside 0–90.
 */
export function coreToLine(
  core: CoreLineAngles,
  hole: Line,
  options: CoreOptions = {},
): Line | undefined {
  if (!validCoreInput(core, hole) || !Number.isFinite(core.gamma)) return undefined
  const frame = holeFrame(hole)
  const alpha = core.alpha * DEG2RAD
  const { n, d } = corePole(alpha, betaFromBottom(core.beta, options) * DEG2RAD, frame)
  // Long axis from the ellipse centre to the down-hole apex: perpendicular to n, in the plane of
  // the core axis and d.
  const u = combine(frame.z, Math.cos(alpha), d, Math.sin(alpha))
  const w = cross(n, u)
  const g = core.gamma * DEG2RAD
  return vecToLine(combine(u, Math.cos(g), w, Math.sin(g)))
}
