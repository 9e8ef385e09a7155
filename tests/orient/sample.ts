import type { Line } from '../../orient'

/** Seeded uniform numbers in [0, 1) (mulberry32), so every test sample is reproducible. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = Math.imul(a ^ (a >>> 15), a | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

const D = Math.PI / 180

/**
 * n lines drawn from a Fisher distribution about a mean (Fisher, Lewis & Embleton 1987, §3.6:
 * cos(theta) = 1 + ln(1 − u(1 − e^(−2k)))/k, azimuth uniform), as axes in the lower hemisphere.
 */
export function fisherSample(mean: Line, kappa: number, n: number, random: () => number): Line[] {
  const t = mean.trend * D
  const p = mean.plunge * D
  const m = [Math.sin(t) * Math.cos(p), Math.cos(t) * Math.cos(p), -Math.sin(p)]
  const h = Math.hypot(m[0], m[1])
  const u = h < 1e-12 ? [1, 0, 0] : [m[1] / h, -m[0] / h, 0]
  const w = [m[1] * u[2] - m[2] * u[1], m[2] * u[0] - m[0] * u[2], m[0] * u[1] - m[1] * u[0]]
  return Array.from({ length: n }, () => {
    const c = 1 + Math.log(1 - random() * (1 - Math.exp(-2 * kappa))) / kappa
    const s = Math.sqrt(Math.max(0, 1 - c * c))
    const phi = 2 * Math.PI * random()
    const v = [0, 1, 2].map((i) => c * m[i] + s * (Math.cos(phi) * u[i] + Math.sin(phi) * w[i]))
    const f = v[2] > 0 ? -1 : 1
    const trend = (Math.atan2(f * v[0], f * v[1]) / D + 360) % 360
    return { trend, plunge: Math.asin(Math.min(1, Math.abs(v[2]))) / D }
  })
}

/** Unit vector (east, north, up) of a line, for assertions written independently of orient/. */
export function vec(line: Line): [number, number, number] {
  const t = line.trend * D
  const p = line.plunge * D
  return [Math.sin(t) * Math.cos(p), Math.cos(t) * Math.cos(p), -Math.sin(p)]
}

export function dot(a: readonly number[], b: readonly number[]): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2]
}
