import { readData, type DataResult } from './data'
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
  type LasDataSet,
  type LasDelimiter,
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
  // LAS 3.0 holds data sets beyond the log: each a ~Name_Definition with its data section(s)
  const setSections: Section[] = []
  for (const s of sections.slice(1)) {
    const kind = sectionKind(s.title, v3)
    if (v3 && (kind === 'C' || kind === 'A') && found[kind]) {
      setSections.push(s) // a second log set, read after the first
      continue
    }
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
    else if (v3 && setRole(s.title)) setSections.push(s)
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
  // a decimal comma in ~W numbers where the comma is not the delimiter (see readData)
  const wellNumber = (item: HeaderItem | undefined) =>
    item
      ? (headerNumber(item.value) ?? (delimiter !== 'COMMA' ? commaNumber(item.value) : null))
      : null
  const nullValue = wellNumber(well.NULL)
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
    textColumns: curveItems.map((c) => v3 && isTextFormat(c.format)),
  })
  if (result.errors.length > 0) throw new LasReadError(result.errors)
  if (result.rows === 0) refuse(data.line, 'The ~A section holds no samples.')
  problems.push(...result.warnings)

  const num = (m: string) => wellNumber(well[m])
  const [start, stop, step] = [num('STRT'), num('STOP'), num('STEP')]
  checkIndex(result.columns[0], { start, stop, step, line: well.STEP?.line ?? null }, problems)
  const curves: LasCurve[] = curveItems.map((item, i) => withText(item, result, i))
  const dataSets = readDataSets(text, setSections, { delimiter, nullValue }, problems)
  for (const set of dataSets) otherSections.push(...set.notes)
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
    dataSets: dataSets.flatMap((d) => (d.set ? [d.set] : [])),
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

/** A curve with its samples (and its text, for a text column). */
function withText(item: HeaderItem, result: DataResult, i: number): LasCurve {
  const text = result.texts[i]
  return text
    ? { ...item, values: result.columns[i], text }
    : { ...item, values: result.columns[i] }
}

/**
 * LAS 3.0 format codes that mean text: `S` (string) and date/time patterns such as DD/MM/YYYY or
 * hh:mm (CWLS LAS 3.0 format codes: F float, E exponential, S string, date/time templates).
 */
export function isTextFormat(format: string): boolean {
  const f = format.trim().toUpperCase()
  if (f === '' || f.startsWith('A')) return false
  if (f.startsWith('S')) return true
  return f.includes(':') || f.includes('DD') || f.includes('MM') || f.includes('YY')
}

/** `-999,25` → −999.25 (one comma, digits around it), else null. */
function commaNumber(value: string): number | null {
  const s = value.trim()
  const comma = s.indexOf(',')
  if (comma < 0 || s.indexOf(',', comma + 1) >= 0 || s.includes('.')) return null
  return headerNumber(`${s.slice(0, comma)}.${s.slice(comma + 1)}`)
}

/**
 * What a LAS 3.0 section is to a data set: `~Core_Definition` defines set CORE, `~Core_Parameter`
 * holds its parameters, and its data is `~Core_Data`, `~Core`, `~Core[2]` or any title associated
 * with the definition by a bar (`~Core[1] | Core_Definition`). The log set itself is the
 * ~Log_*, ~Curve/~ASCII and ~C/~A sections. Null for a section of no set.
 */
export function setRole(
  title: string,
): { role: 'definition' | 'parameter' | 'data'; base: string } | null {
  const word = titleWord(title)
  const bar = title.indexOf('|')
  if (bar >= 0) {
    const target = titleWord(title.slice(bar + 1).trim())
    if (target.endsWith('_DEFINITION'))
      return { role: 'data', base: setBase(target, '_DEFINITION') }
    if (target === 'CURVE' || target === 'C') return { role: 'data', base: 'LOG' }
  }
  if (word.endsWith('_DEFINITION'))
    return { role: 'definition', base: setBase(word, '_DEFINITION') }
  if (word.endsWith('_PARAMETER')) return { role: 'parameter', base: setBase(word, '_PARAMETER') }
  if (word.endsWith('_DATA')) return { role: 'data', base: setBase(word, '_DATA') }
  return null
}

/** `CORE[2]_DEFINITION` → CORE; `LOG_DATA` → LOG. */
function setBase(word: string, suffix: string): string {
  const stem = word.slice(0, word.length - suffix.length)
  const bracket = stem.indexOf('[')
  return bracket >= 0 ? stem.slice(0, bracket) : stem
}

interface SetOutcome {
  set?: LasDataSet
  notes: LasSectionNote[]
}

/**
 * Reads the LAS 3.0 data sets beyond the first log: a second log (~C/~A pair or ~Log_Definition
 * with its data) and every ~Name_Definition with its data sections (several data sections of one
 * definition, `~Core[1]`, `~Core[2]`, are read one after the other). A set that cannot be read is
 * noted with its reason; it never refuses the file, whose log was read.
 */
function readDataSets(
  text: string,
  sections: readonly Section[],
  options: { delimiter: LasDelimiter; nullValue: number | null },
  problems: ProblemLog,
): SetOutcome[] {
  const definitions = new Map<string, Section>()
  const data: { base: string; section: Section }[] = []
  for (const s of sections) {
    const kind = sectionKind(s.title, true)
    const role =
      kind === 'C'
        ? { role: 'definition' as const, base: 'LOG' }
        : kind === 'A'
          ? { role: 'data' as const, base: 'LOG' }
          : setRole(s.title)
    if (!role || role.role === 'parameter') continue
    if (role.role === 'definition') {
      // a second log definition: name it apart from the first
      const base =
        definitions.has(role.base) || role.base === 'LOG'
          ? uniqueBase(definitions, role.base)
          : role.base
      definitions.set(base, s)
    } else
      data.push({ base: role.base === 'LOG' ? lastLogBase(definitions) : role.base, section: s })
  }
  const out: SetOutcome[] = []
  for (const [base, definition] of definitions) {
    const mine = data.filter((d) => d.base === base)
    if (mine.length === 0) {
      problems.push({
        line: definition.line,
        message: `~${titleWord(definition.title)} has no data section: noted.`,
      })
      out.push({ notes: [note(definition)] })
      continue
    }
    for (const [k, d] of mine.entries()) {
      const name = mine.length > 1 ? `${base} [${k + 1}]` : base
      out.push(readSet(text, name, definition, d.section, options, problems))
    }
  }
  for (const d of data) {
    if (definitions.has(d.base)) continue
    problems.push({
      line: d.section.line,
      message: `~${titleWord(d.section.title)} has no definition section: noted, not read.`,
    })
    out.push({ notes: [note(d.section)] })
  }
  return out
}

function uniqueBase(definitions: Map<string, Section>, base: string): string {
  for (let n = 2; ; n++) if (!definitions.has(`${base} (${n})`)) return `${base} (${n})`
}

function lastLogBase(definitions: Map<string, Section>): string {
  let last = 'LOG (2)'
  for (const base of definitions.keys()) if (base.startsWith('LOG (')) last = base
  return last
}

function note(s: Section): LasSectionNote {
  return {
    title: s.title.slice(0, 80),
    line: s.line,
    inclinometry: titleWord(s.title).startsWith('INCLINOMETRY'),
  }
}

function readSet(
  text: string,
  name: string,
  definition: Section,
  dataSection: Section,
  options: { delimiter: LasDelimiter; nullValue: number | null },
  problems: ProblemLog,
): SetOutcome {
  const notes = [note(definition), note(dataSection)]
  const inclinometry = name.startsWith('INCLINOMETRY')
  try {
    const items = readItems(text, definition, true, problems, true)
    if (items.length === 0)
      refuse(definition.line, `~${titleWord(definition.title)} defines no columns.`)
    renameDuplicates(items, problems)
    const result = readData({
      ...dataSection,
      text,
      curveCount: items.length,
      wrap: false,
      delimiter: options.delimiter,
      nullValue: options.nullValue,
      textColumns: items.map((c) => isTextFormat(c.format)),
    })
    if (result.errors.length > 0) throw new LasReadError(result.errors)
    const unit = items[0].unit.toUpperCase()
    const metres = metresPerUnit(unit) ?? null
    const set: LasDataSet = {
      name,
      kind: name.startsWith('LOG') ? 'log' : inclinometry ? 'inclinometry' : 'other',
      line: definition.line,
      curves: items.map((item, i) => withText(item, result, i)),
      sampleCount: result.rows,
      depthUnit: unit,
      metresPerDepthUnit: metres,
    }
    problems.push({
      line: dataSection.line,
      message: `Data set ${name}: ${result.rows} row${result.rows === 1 ? '' : 's'} of ${items.length} columns read${inclinometry ? ' (a hole survey: offered as a survey import)' : ''}.`,
    })
    return { set, notes: [] }
  } catch (err) {
    if (!(err instanceof LasReadError)) throw err
    const first = err.issues[0]
    problems.push({
      line: first?.line ?? dataSection.line,
      message: `Data set ${name} not read: ${first?.message ?? 'unreadable'}`,
    })
    return { notes }
  }
}
