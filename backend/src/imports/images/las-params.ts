import { headerNumber, type HeaderItem, type LasFile } from '../las/index'
import { refuseFile } from './limits'

/**
 * The header items read for an image array, looked for in ~P (LAS 3.0 ~Log_Parameter too) and
 * then ~W, by mnemonic (case aside). These names are ours, chosen after the short forms logging
 * companies write (from memory); a file that names them otherwise gets the defaults, noted.
 */
export const AZIMUTH_STEP_ITEMS = ['AZSTEP', 'AZ_STEP', 'AZINC', 'AZ_INC', 'AZIMUTH_STEP', 'DAZ']
export const AZIMUTH_START_ITEMS = ['AZSTART', 'AZ_START', 'AZ0', 'AZFIRST', 'AZIMUTH_START']
export const BIT_SIZE_ITEMS = ['BS', 'BIT', 'BITSIZE', 'BIT_SIZE']
/** Caliper curves: CAL, CALI, CALX, CALY, CAL1… (not array members: see findArrays). */
const CALIPER = /^CAL[A-Z0-9_]*$/

const DEGREES = new Set(['DEG', 'DEGS', 'DEGREE', 'DEGREES', '°'])
const MM_PER_UNIT: Record<string, number> = { MM: 1, CM: 10, M: 1000, IN: 25.4, INCH: 25.4 }
/** Diameters outside this are a wrong unit or a dead caliper, not a borehole (the form's range). */
const DIAMETER_MM = { min: 20, max: 2000 }

function findItem(las: LasFile, names: readonly string[]): HeaderItem | undefined {
  const wanted = new Set(names)
  return (
    las.parameters.find((p) => wanted.has(p.mnemonic.toUpperCase())) ??
    Object.values(las.well).find((w) => wanted.has(w.mnemonic.toUpperCase()))
  )
}

const unitOf = (item: { unit: string }) => item.unit.trim().toUpperCase()
const where = (item: HeaderItem) => `${item.mnemonic}, line ${item.line}`

/**
 * The azimuth step is 360°/N for the image geometry; a header step in degrees must agree (within
 * half a step) or the array does not cover one turn and is refused, naming the line.
 */
export function checkAzimuthStep(las: LasFile, stem: string, width: number, notes: string[]) {
  const item = findItem(las, AZIMUTH_STEP_ITEMS)
  if (!item)
    return notes.push(
      `Array ${stem}: ${width} samples a turn, ${+(360 / width).toFixed(4)}° apart.`,
    )
  const step = headerNumber(item.value)
  if (step === null || !DEGREES.has(unitOf(item)))
    return notes.push(`${where(item)}: not a number of degrees, left out; 360°/${width} used.`)
  if (Math.abs(step * width - 360) > step / 2) {
    const message = `${item.mnemonic} ${step}° × ${width} samples of array ${stem} covers ${+(step * width).toFixed(2)}°, not one turn.`
    throw refuseFile('invalid_file', message, [{ path: `file.line.${item.line}`, message }])
  }
  notes.push(`Array ${stem}: ${width} samples a turn, ${step}° apart (${where(item)}).`)
}

/**
 * The left edge of column 0 in degrees. A start item gives the first sample's azimuth, the
 * centre of column 0, so the edge lies half a step before it; without one the edge is at 0°.
 */
export function lasLeftAzimuth(las: LasFile, width: number, notes: string[]): number {
  const item = findItem(las, AZIMUTH_START_ITEMS)
  const start = item && DEGREES.has(unitOf(item)) ? headerNumber(item.value) : null
  if (item && start !== null) {
    notes.push(`First sample at ${start}° (${where(item)}): column 0 starts half a step before.`)
    return start - 180 / width
  }
  notes.push('No azimuth-start item: column 0 taken to start at 0°.')
  return 0
}

/** The bit size in mm from BS/BIT with a length unit, or undefined (noted) when absent or odd. */
export function bitSizeMm(las: LasFile, notes: string[]): number | undefined {
  const item = findItem(las, BIT_SIZE_ITEMS)
  if (!item) return undefined
  const value = headerNumber(item.value)
  const per = MM_PER_UNIT[unitOf(item)]
  const mm = value !== null && per ? value * per : NaN
  if (mm >= DIAMETER_MM.min && mm <= DIAMETER_MM.max) return mm
  notes.push(`${where(item)}: "${item.value} ${item.unit}" is not a bit size, left out.`)
  return undefined
}

/** Mean of every caliper curve over the image's samples, in mm, or undefined (noted). */
export function caliperMm(las: LasFile, source: Int32Array, notes: string[]): number | undefined {
  let sum = 0
  let count = 0
  const used: string[] = []
  for (const curve of las.curves.slice(1)) {
    if (!CALIPER.test(curve.mnemonic.toUpperCase()) || curve.text) continue
    const per = MM_PER_UNIT[unitOf(curve)]
    if (!per) {
      notes.push(`Caliper ${curve.mnemonic} in "${curve.unit}" (not IN, MM, CM or M): left out.`)
      continue
    }
    const before = count
    for (const i of source) {
      const v = i >= 0 ? curve.values[i] : NaN
      if (Number.isFinite(v)) {
        sum += v * per
        count++
      }
    }
    if (count > before) used.push(`${curve.mnemonic} (${unitOf(curve)})`)
  }
  if (count === 0) return undefined
  const mm = sum / count
  if (mm >= DIAMETER_MM.min && mm <= DIAMETER_MM.max) {
    notes.push(`Diameter ${+mm.toFixed(1)} mm: mean of ${used.join(', ')} over the image.`)
    return mm
  }
  notes.push(`Caliper mean ${+mm.toFixed(1)} mm is not a borehole diameter: left out.`)
  return undefined
}
