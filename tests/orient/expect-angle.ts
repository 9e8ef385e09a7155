import { expect } from 'vitest'

/**
 * Asserts two angles agree within tolDeg, comparing their difference modulo 360 (so 359.99 and
 * 0.01 are 0.02 apart). For an axis known only modulo 180, compare doubled angles.
 */
export function expectAngle(actual: number | undefined, expected: number, tolDeg: number): void {
  expect(actual, 'angle is a number').toBeTypeOf('number')
  expect(Number.isFinite(actual), `angle ${actual} is finite`).toBe(true)
  const diff = (((((actual as number) - expected) % 360) + 540) % 360) - 180
  expect(Math.abs(diff), `angle ${actual} vs ${expected} (±${tolDeg})`).toBeLessThanOrEqual(tolDeg)
}
