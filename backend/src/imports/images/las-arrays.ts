import type { LasCurve } from '../las/index'
import type { ImageKind } from '../../../../schema/vocabulary'
import { refuseFile } from './limits'

/** Curves sharing a stem with an index: one image, a member a column, in index order. */
export interface LasArray {
  stem: string
  members: LasCurve[]
  /** The stem's kind when its name says it (AMP…, TT…), else undefined. */
  kind: ImageKind | undefined
}

/** Fewer members than this are separate curves (four caliper arms), not an image. */
export const MIN_ARRAY_MEMBERS = 8

/**
 * `AMP[3]` (LAS 3.0 array elements, and AMP[0]… from tools counting from 0), `AMP_3`, `AMP-3`
 * and `AMP03`: the stem and its index, or undefined for a curve that is not an array member.
 */
export function arrayMember(mnemonic: string): { stem: string; index: number } | undefined {
  const m = mnemonic.trim()
  const open = m.indexOf('[')
  if (open > 0 && m.endsWith(']')) {
    const digits = m.slice(open + 1, -1)
    return isDigits(digits) ? { stem: m.slice(0, open).toUpperCase(), index: +digits } : undefined
  }
  let j = m.length
  while (j > 0 && m.charCodeAt(j - 1) >= 48 && m.charCodeAt(j - 1) <= 57) j--
  if (j === m.length || m.length - j > 4) return undefined
  let stem = m.slice(0, j)
  if (stem.endsWith('_') || stem.endsWith('-')) stem = stem.slice(0, -1)
  if (!/^[A-Za-z][A-Za-z0-9_]*$/.test(stem)) return undefined
  return { stem: stem.toUpperCase(), index: +m.slice(j) }
}

const isDigits = (s: string) => s.length > 0 && s.length <= 4 && /^[0-9]+$/.test(s)

/**
 * Stems that name what an array holds (common practice in televiewer LAS exports, from memory):
 * AMP/AMPL… acoustic amplitude; TT, TRT, TIME, TRAV… acoustic travel time.
 */
export function kindOfStem(stem: string): ImageKind | undefined {
  if (stem.startsWith('AMP')) return 'amplitude'
  if (['TT', 'TRT', 'TIME', 'TRAV', 'TTIM'].some((p) => stem.startsWith(p))) return 'traveltime'
  return undefined
}

/**
 * Every image array of the file: members grouped by stem (case aside), at least eight, their
 * indices one consecutive run (a gap or a repeat is refused, naming the curve). Caliper arms
 * (CAL1…CALn) are never an image; renamed repeats (`AMP01:2`) are not members.
 */
export function findArrays(curves: readonly LasCurve[]): LasArray[] {
  const groups = new Map<string, { index: number; curve: LasCurve }[]>()
  for (const curve of curves.slice(1)) {
    if (curve.text || curve.mnemonic.includes(':')) continue
    const member = arrayMember(curve.mnemonic)
    if (!member || member.stem.startsWith('CAL')) continue
    const list = groups.get(member.stem) ?? []
    list.push({ index: member.index, curve })
    groups.set(member.stem, list)
  }
  const arrays: LasArray[] = []
  for (const [stem, list] of groups) {
    if (list.length < MIN_ARRAY_MEMBERS) continue
    list.sort((a, b) => a.index - b.index)
    for (let k = 1; k < list.length; k++) {
      const want = list[0].index + k
      if (list[k].index === want) continue
      const at = list[k].curve
      const message =
        list[k].index === list[k - 1].index
          ? `Curves ${list[k - 1].curve.mnemonic} and ${at.mnemonic} give the same index of array ${stem}.`
          : `Array ${stem}: index ${want} is missing (${list[k - 1].curve.mnemonic} is followed by ${at.mnemonic}).`
      throw refuseFile('invalid_file', message, [{ path: `file.line.${at.line}`, message }])
    }
    arrays.push({ stem, members: list.map((m) => m.curve), kind: kindOfStem(stem) })
  }
  return arrays
}
