/** Depth units LAS files use for the index (CWLS LAS 2.0: M, F or FT; .1IN from older tools). */
const METRES_PER_UNIT: Record<string, number> = {
  M: 1,
  METER: 1,
  METERS: 1,
  METRE: 1,
  METRES: 1,
  // international foot, exactly 0.3048 m
  F: 0.3048,
  FT: 0.3048,
  FEET: 0.3048,
  FOOT: 0.3048,
  '.1IN': 0.00254,
}

/** Metres per unit for a depth unit as written in a LAS file, or undefined when not a depth unit. */
export function metresPerUnit(unit: string): number | undefined {
  return METRES_PER_UNIT[unit.trim().toUpperCase()]
}
