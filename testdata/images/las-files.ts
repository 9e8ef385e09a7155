/**
 * LAS test files with image arrays (invented, Greyscar Quarry), built as text by make-images.ts.
 * Values come from the same wall pattern as the rasters; a few samples are the file's NULL.
 */
import { wall } from './raster-files'

interface ArraySpec {
  /** Mnemonic of member i (0-based). */
  name: (i: number) => string
  members: number
  unit: string
  description: string
  /** Value of member i at row r (a number, or null for the file's NULL). */
  value: (r: number, i: number) => number | null
}

interface LasSpec {
  version: '2.0' | '3.0'
  well: string
  depths: number[]
  nullValue?: number
  parameters?: string[]
  /** Single curves besides the arrays: mnemonic.unit, description, value at row r. */
  curves?: { head: string; description: string; value: (r: number) => number }[]
  arrays: ArraySpec[]
}

const fmt = (v: number | null, nullValue: number) => (v === null ? nullValue : v).toFixed(3)

export function lasText(s: LasSpec): string {
  const v3 = s.version === '3.0'
  const nullValue = s.nullValue ?? -999.25
  const step = s.depths[1] - s.depths[0]
  const regular = s.depths.every((d, i) => i === 0 || Math.abs(d - s.depths[i - 1] - step) < 1e-9)
  const defs = [` DEPT.M : DEPTH${v3 ? ' {F}' : ''}`]
  for (const c of s.curves ?? []) defs.push(` ${c.head} : ${c.description}${v3 ? ' {F}' : ''}`)
  for (const a of s.arrays)
    for (let i = 0; i < a.members; i++)
      defs.push(` ${a.name(i)}.${a.unit} : ${a.description} ${i + 1}${v3 ? ' {F}' : ''}`)
  const sep = v3 ? ',' : ' '
  const data = s.depths.map((d, r) => {
    const values = [d.toFixed(4)]
    for (const c of s.curves ?? []) values.push(fmt(c.value(r), nullValue))
    for (const a of s.arrays)
      for (let i = 0; i < a.members; i++) values.push(fmt(a.value(r, i), nullValue))
    return values.join(sep)
  })
  return [
    v3 ? '~Version' : '~Version Information',
    ` VERS.   ${s.version} : CWLS LOG ASCII STANDARD - VERSION ${s.version}`,
    ' WRAP.   NO  : ONE LINE PER DEPTH STEP',
    ...(v3 ? [' DLM .   COMMA : DELIMITING CHARACTER'] : []),
    v3 ? '~Well' : '~Well Information',
    ` STRT.M   ${s.depths[0].toFixed(4)} : START DEPTH`,
    ` STOP.M   ${s.depths.at(-1)!.toFixed(4)} : STOP DEPTH`,
    ` STEP.M   ${regular ? step.toFixed(4) : '0'} : STEP`,
    ` NULL.    ${nullValue} : NULL VALUE`,
    ' COMP.    GREYSCAR QUARRY LTD : COMPANY',
    ` WELL.    ${s.well} : WELL`,
    ...(s.parameters?.length ? [v3 ? '~Log_Parameter' : '~Parameter Information', ...s.parameters] : []),
    v3 ? '~Log_Definition' : '~Curve Information',
    ...defs,
    v3 ? '~Log_Data | Log_Definition' : '~A',
    ...data,
    '',
  ].join('\n')
}

export const regularDepths = (top: number, step: number, rows: number) =>
  Array.from({ length: rows }, (_, r) => +(top + r * step).toFixed(6))

const pad2 = (i: number) => String(i + 1).padStart(2, '0')

/** Acoustic amplitude in mV (made up): the wall pattern, one sample in 97 NULL. */
export const amplitude =
  (members: number, rows: number) =>
  (r: number, i: number): number | null =>
    (r * members + i) % 97 === 13 ? null : +(20 + 980 * wall(members, rows, r, i)).toFixed(3)
/** Travel time in µs (made up): longer where the wall is dark (an open trace). */
export const travelTime =
  (members: number, rows: number) =>
  (r: number, i: number): number =>
    +(60 + 15 * (1 - wall(members, rows, r, i))).toFixed(3)

export const amp72 = (rows: number): ArraySpec => ({
  name: (i) => `AMP${pad2(i)}`,
  members: 72,
  unit: 'MV',
  description: 'ACOUSTIC AMPLITUDE',
  value: amplitude(72, rows),
})

export const bracketArray = (
  stem: string,
  unit: string,
  members: number,
  from: 0 | 1,
  value: ArraySpec['value'],
): ArraySpec => ({
  name: (i) => `${stem}[${i + from}]`,
  members,
  unit,
  description: stem,
  value,
})
