import { decodeLasText, LasReadError, readLas, type LasFile } from '../las/index'
import { findArrays, type LasArray } from './las-arrays'
import { lasRows, type LasRows } from './las-depths'
import { refuseFile } from './limits'
import type { DecodedImage } from './types'

/**
 * The reader keeps every curve as float64 for every data line: curves × lines × 8 bytes. Our cap,
 * 40 M values (320 MB), takes a 300 m hole at 2 mm with two 72-sample arrays (22 M) and refuses a
 * file built to exhaust memory before the reader allocates anything.
 */
export const MAX_LAS_VALUES = 40_000_000

/** A LAS file read for its image arrays: the log, its rows on a regular grid, the arrays. */
export interface LasImages {
  las: LasFile
  rows: LasRows
  arrays: LasArray[]
  notes: string[]
}

/** Reads a LAS file (the shared reader) and finds its image arrays; refusals name the line. */
export function readLasImages(bytes: Uint8Array): LasImages {
  let las: LasFile
  const notes: string[] = []
  try {
    const { text, encoding } = decodeLasText(bytes)
    if (encoding !== 'utf-8') notes.push(`Read as ${encoding.toUpperCase()} text.`)
    checkLasSize(text)
    las = readLas(text)
  } catch (err: unknown) {
    if (!(err instanceof LasReadError)) throw err
    const details = err.issues.map((i) => ({ path: `file.line.${i.line}`, message: i.message }))
    throw refuseFile('invalid_file', `The LAS file cannot be read: ${err.message}`, details)
  }
  const arrays = findArrays(las.curves)
  if (arrays.length === 0)
    throw refuseFile(
      'invalid_file',
      'The LAS file holds no image array: curves sharing a name with an index (AMP01…AMP72, AMP[0]…AMP[71], AMP_1…), at least 8 of them.',
    )
  // what the reader read around, as it said it (the first few)
  for (const p of las.problems.slice(0, 10))
    notes.push(p.line === null ? p.message : `Line ${p.line}: ${p.message}`)
  const depths = Float64Array.from(las.curves[0].values, (d) => d * las.metresPerDepthUnit)
  return { las, rows: lasRows(depths), arrays, notes }
}

/**
 * Refuses a file whose definition sections times the lines after them pass MAX_LAS_VALUES: an
 * upper bound of what the reader would allocate, found in one pass over the line ends.
 */
function checkLasSize(text: string): void {
  let lines = 0
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) lines++
  let line = 0
  let curves = 0
  let counting = false
  let worst = 0
  for (let at = 0; at < text.length; line++) {
    const end = text.indexOf('\n', at)
    const stop = end < 0 ? text.length : end
    const first = text.slice(at, Math.min(stop, at + 40)).trimStart()
    if (first.startsWith('~')) {
      worst = Math.max(worst, curves * (lines - line))
      const word = first.slice(1).toUpperCase()
      counting = word.startsWith('C') || word.includes('_DEFINITION')
      curves = 0
    } else if (counting && first !== '' && !first.startsWith('#')) curves++
    at = stop + 1
  }
  worst = Math.max(worst, curves)
  if (worst > MAX_LAS_VALUES)
    throw refuseFile(
      'image_too_large',
      `The LAS file would hold up to ${worst} values: at most ${MAX_LAS_VALUES} are read.`,
      undefined,
      413,
    )
}

/** The array's finite range over the image's rows: what samples 1 and 65535 stand for. */
export function arrayRange(array: LasArray, rows: LasRows): { valueMin: number; valueMax: number } {
  let lo = Infinity
  let hi = -Infinity
  for (const m of array.members)
    for (const i of rows.source) {
      const v = i >= 0 ? m.values[i] : NaN
      if (v < lo) lo = v
      if (v > hi) hi = v
    }
  if (!(hi >= lo))
    throw refuseFile('invalid_file', `Array ${array.stem} holds only NULL values: no image.`)
  return { valueMin: lo, valueMax: hi }
}

/**
 * One array's samples as stored: uint16 where 0 = no value (the file's NULL, or no sample for the
 * row) and 1…65535 map linearly onto [valueMin, valueMax] (see arrayRange).
 */
export function arraySamples(
  array: LasArray,
  rows: LasRows,
  range: { valueMin: number; valueMax: number },
): DecodedImage {
  const width = array.members.length
  const lo = range.valueMin
  const scale = range.valueMax > lo ? 65534 / (range.valueMax - lo) : 0
  const samples = new Uint16Array(rows.rows * width)
  for (let c = 0; c < width; c++) {
    const values = array.members[c].values
    for (let r = 0; r < rows.rows; r++) {
      const i = rows.source[r]
      const v = i >= 0 ? values[i] : NaN
      const s = 1 + Math.round((v - lo) * scale)
      samples[r * width + c] = Number.isFinite(v) ? Math.min(65535, Math.max(1, s)) : 0
    }
  }
  return { width, rows: rows.rows, channels: 1, samples, zeroIsNoValue: true }
}
