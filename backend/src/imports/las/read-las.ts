import { readData } from './data'
import { headerNumber } from './header-line'
import { readItems, readOther, readVersion } from './header-sections'
import { checkIndex } from './checks'
import { scanSections, sectionKind, titleWord, type Section } from './sections'
import { decodeLasText, uniformLineEnds } from './text'
import { metresPerUnit } from './units'
import {
  LasReadError,
  ProblemLog,
  refuse,
  type HeaderItem,
  type LasCurve,
  type LasFile,
  type LasSectionNote,
} from './types'

/**
 * Reads a LAS 2.0 or 3.0 file (CWLS Log ASCII Standard) from its bytes or text. Linear in the
 * file size and free of backtracking patterns, so hostile input cannot stall it. Throws
 * LasReadError (with line numbers) for a file that cannot be read as a depth log; returns
 * warnings in `problems` for what it read around.
 */
export function readLas(input: Uint8Array | string): LasFile {
  const decoded =
    typeof input === 'string'
      ? { text: uniformLineEnds(input), encoding: 'utf-8' as const }
      : decodeLasText(input)
  let text = decoded.text
  // a byte-order mark is not content (TextDecoder drops it from bytes; strings may keep it)
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1)
  const problems = new ProblemLog()
  if (decoded.encoding !== 'utf-8') {
    problems.push({
      line: 1,
      message: `Read as ${decoded.encoding === 'windows-1252' ? 'Windows-1252 (not valid UTF-8)' : decoded.encoding.toUpperCase()} text.`,
    })
  }
  const sections = scanSections(text)
  const head = sections[0]
  if (sectionKind(head.title, false) !== 'V') {
    refuse(head.line, `The first section must be ~V (version), not ~${head.title.slice(0, 30)}.`)
  }
  const { version, wrap, delimiter } = readVersion(text, head, problems)
  const v3 = version === '3.0'
  const found: Partial<Record<'W' | 'C' | 'A', Section>> = {}
  const parameters: HeaderItem[] = []
  const wellItems: HeaderItem[] = []
  const otherSections: LasSectionNote[] = []
  let other = ''
  for (const s of sections.slice(1)) {
    const kind = sectionKind(s.title, v3)
    if (kind === 'V' || ((kind === 'C' || kind === 'A') && found[kind])) {
      refuse(s.line, `A second ~${kind} section: the file must have only one.`)
    }
    if (!v3 && found.A) {
      problems.push({ line: s.line, message: 'A section after ~A (LAS 2.0 puts ~A last).' })
    }
    if (kind === 'W') appendAll(wellItems, readItems(text, s, v3, problems))
    else if (kind === 'P') appendAll(parameters, readItems(text, s, v3, problems))
    else if (kind === 'O') other = other ? `${other}\n${readOther(text, s)}` : readOther(text, s)
    else if (kind === 'C' || kind === 'A') found[kind] = s
    else {
      const inclinometry = titleWord(s.title).startsWith('INCLINOMETRY')
      otherSections.push({ title: s.title.slice(0, 80), line: s.line, inclinometry })
      problems.push({
        line: s.line,
        message: `Section ~${titleWord(s.title).slice(0, 40)} noted, not imported.`,
      })
    }
  }
  const curveSection = found.C
  const data = found.A
  if (!curveSection)
    refuse(sections.at(-1)!.line, 'No ~C (curve) section: the columns are unknown.')
  if (!data) refuse(lineCount(text), 'No ~A (data) section: the file ends without samples.')

  if (version === '1.2') swapWellText(wellItems)
  const well: Record<string, HeaderItem> = {}
  for (const item of wellItems) {
    const key = item.mnemonic.toUpperCase()
    if (well[key])
      problems.push({ line: item.line, message: `${key} given twice: the first kept.` })
    else well[key] = item
  }
  const curveItems = readItems(text, curveSection, v3, problems, true)
  if (curveItems.length === 0) refuse(curveSection.line, 'The ~C section defines no curves.')
  renameDuplicates(curveItems, problems)

  const index = curveItems[0]
  const unitItem = index.unit ? index : well.STRT
  const depthUnit = (unitItem?.unit ?? '').toUpperCase()
  let metres = metresPerUnit(depthUnit)
  if (metres === undefined) {
    if (depthUnit !== '') {
      refuse(
        index.line,
        `The index ${index.mnemonic} is in "${depthUnit}": only depth logs (M, F, FT) are read.`,
      )
    }
    problems.push({ line: index.line, message: 'No depth unit given: metres assumed.' })
    metres = 1
  }
  const nullValue = well.NULL ? headerNumber(well.NULL.value) : null
  if (nullValue === null)
    problems.push({
      line: well.NULL?.line ?? null,
      message: 'No numeric NULL value: no sample is read as absent.',
    })

  const result = readData({
    ...data,
    text,
    curveCount: curveItems.length,
    wrap,
    delimiter,
    nullValue,
  })
  if (result.errors.length > 0) throw new LasReadError(result.errors)
  if (result.rows === 0) refuse(data.line, 'The ~A section holds no samples.')
  problems.push(...result.warnings)

  const num = (m: string) => (well[m] ? headerNumber(well[m].value) : null)
  const [start, stop, step] = [num('STRT'), num('STOP'), num('STEP')]
  checkIndex(result.columns[0], { start, stop, step, line: well.STEP?.line ?? null }, problems)
  const curves: LasCurve[] = curveItems.map((item, i) => ({ ...item, values: result.columns[i] }))
  return {
    version,
    wrap,
    delimiter,
    well,
    start,
    stop,
    step,
    nullValue,
    parameters,
    other,
    curves,
    depthUnit: depthUnit || 'M',
    metresPerDepthUnit: metres,
    sampleCount: result.rows,
    otherSections,
    problems: problems.toArray(),
  }
}

/** Two curves named alike (GR twice) would clash by mnemonic: the later ones become GR:2, GR:3. */
function renameDuplicates(items: HeaderItem[], problems: ProblemLog) {
  const seen = new Map<string, number>()
  for (const item of items) {
    const key = item.mnemonic.toUpperCase()
    const count = (seen.get(key) ?? 0) + 1
    seen.set(key, count)
    if (count > 1) {
      problems.push({
        line: item.line,
        message: `Curve ${item.mnemonic} repeated: read as ${item.mnemonic}:${count}.`,
      })
      item.mnemonic = `${item.mnemonic}:${count}`
    }
  }
}

function lineCount(text: string): number {
  let n = 1
  for (let i = text.indexOf('\n'); i >= 0 && i < text.length - 1; i = text.indexOf('\n', i + 1)) n++
  return n
}

/** push(...items) overflows the stack past ~100,000 items; a junk header can have millions. */
function appendAll<T>(target: T[], items: T[]) {
  for (const item of items) target.push(item)
}

/** The labels LAS 1.2 writes before the colon of its ~W text items [from memory of its examples]. */
const WELL_LABELS = new Set([
  'COMPANY',
  'WELL',
  'FIELD',
  'LOCATION',
  'PROVINCE',
  'COUNTY',
  'STATE',
  'COUNTRY',
  'SERVICE COMPANY',
  'DATE',
  'LOG DATE',
  'UNIQUE WELL ID',
  'API NUMBER',
  'LICENCE NUMBER',
  'LICENSE NUMBER',
])

/**
 * LAS 1.2 writes the ~W text items as `COMP.   COMPANY:  ANY OIL COMPANY INC.` — the item's label
 * before the colon and its value after it, where 2.0 has `COMP.  ANY OIL COMPANY INC. : COMPANY`
 * [from memory of the CWLS LAS 1.2 specification's example]; STRT, STOP, STEP and NULL are the same
 * in both. An item is swapped back only when the part before the colon is one of those labels, so
 * a 1.2 file written the 2.0 way is read as written.
 */
function swapWellText(items: HeaderItem[]): void {
  for (const item of items) {
    if (item.description === '' || !WELL_LABELS.has(item.value.trim().toUpperCase())) continue
    const { value, description } = item
    item.value = description
    item.description = value
  }
}
