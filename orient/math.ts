/** Tolerance for unit-vector arithmetic: lengths, dot products and cross products below it are zero. */
export const EPSILON = 1e-12

export const DEG2RAD = Math.PI / 180
export const RAD2DEG = 180 / Math.PI

/** acos clamped to [-1, 1]: rounding past ±1 gives 0 or π, never NaN. */
export function acos(x: number): number {
  return x >= 1 ? 0 : x <= -1 ? Math.PI : Math.acos(x)
}

/** asin clamped to [-1, 1]: rounding past ±1 gives ±π/2, never NaN. */
export function asin(x: number): number {
  return x >= 1 ? Math.PI / 2 : x <= -1 ? -Math.PI / 2 : Math.asin(x)
}

/** An azimuth in degrees wrapped into [0, 360); 360 becomes 0. */
export function wrap360(deg: number): number {
  const r = deg % 360
  const w = r < 0 ? r + 360 : r
  // -1e-15 % 360 + 360 rounds to 360 itself.
  return w >= 360 ? 0 : w
}

/** Smallest absolute difference between two azimuths in degrees, in [0, 180]. */
export function azimuthDifference(a: number, b: number): number {
  // Wrapping each first keeps a − b from overflowing for huge finite inputs.
  const d = wrap360(wrap360(a) - wrap360(b))
  return d > 180 ? 360 - d : d
}

/** True when every argument is a finite number (the API-edge check for NaN and ±Infinity). */
export function finite(...values: number[]): boolean {
  for (const v of values) if (!Number.isFinite(v)) return false
  return true
}

/**
 * Adds x to the compensated sum held at acc[k] (sum) and acc[k + 1] (running error) by TwoSum
 * (Knuth 1969, TAOCP vol. 2, §4.2.2): t + error is exactly sum + x whatever their magnitudes, so a
 * million terms lose nothing to rounding. Typed-array storage keeps hot loops allocation-free.
 */
export function twoSum(acc: Float64Array, k: number, x: number): void {
  const s = acc[k]
  const t = s + x
  const b = t - s
  acc[k + 1] += s - (t - b) + (x - b)
  acc[k] = t
}
