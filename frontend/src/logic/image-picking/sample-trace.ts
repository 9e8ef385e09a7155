// Points along a known sinusoid (an accepted suggestion), for the API, which takes points and fits
// them itself: evenly spaced round the turn, they give back the same sinusoid exactly.
import { sinusoidDepthAt, wrap360, type Sinusoid } from '../../../../orient/index'
import type { TracePoint } from '../../api/images'

/** How many points an accepted suggestion is sampled into (every 30°). */
export const SAMPLES_PER_TURN = 12

/**
 * `count` points at azimuths start + k·360/count on the trace of `s` (height in metres). Any
 * three or more evenly spaced azimuths make sin and cos orthogonal over the sample, so the least
 * squares fit returns d₀, a and b unchanged [derived: discrete orthogonality of sin/cos].
 */
export function sampleTrace(s: Sinusoid, count = SAMPLES_PER_TURN, start = 0): TracePoint[] {
  const n = Math.max(3, Math.round(count))
  return Array.from({ length: n }, (_, k) => {
    const azimuth = wrap360(start + (k * 360) / n)
    return { depth: sinusoidDepthAt(s, azimuth), azimuth }
  })
}
