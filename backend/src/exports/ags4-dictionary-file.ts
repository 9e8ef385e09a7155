import { z } from 'zod'
import { AGS_EDITION_FORM, agsStatuses } from '../../../schema/ags'
import { parseAgs, type ParsedGroup } from './ags4-parse'
import type { StandardGroup } from './ags4-standard'
import { declaredEdition } from './ags4-validate'
import { knownTypes } from './ags4-values'

/** A problem that keeps a file from being read as a dictionary: where (line, heading) and what. */
export interface DictionaryFileProblem {
  line?: number
  field?: string
  message: string
}

export class DictionaryFileError extends Error {
  constructor(readonly problems: DictionaryFileProblem[]) {
    super(problems[0]?.message ?? 'not an AGS4 standard dictionary')
  }
}

export interface DictionaryFile {
  /** TRAN_AGS as the file gives it, with its line; null where the file has none. */
  edition: { value: string; line: number } | null
  groups: StandardGroup[]
  headingCount: number
}

/** Problems listed per refusal; the count says how many more there were. */
const SHOWN = 50

const groupName = z
  .string()
  .regex(/^[A-Z0-9]{4}$/, 'a group name is 4 upper-case letters or digits')
const status = z
  .string()
  .transform((s) => s.toUpperCase().replace(/\s+/g, '').replace('REQUIRED+KEY', 'KEY+REQUIRED'))
  .transform((s) => (s === '' ? 'OTHER' : s))
  .pipe(z.enum(agsStatuses, { error: 'KEY, REQUIRED, KEY+REQUIRED or OTHER' }))

/** One DICT row of a standard dictionary, by its DICT_TYPE (AGS4 DICT group, from memory). */
const DictRow = z.discriminatedUnion(
  'DICT_TYPE',
  [
    z.object({
      DICT_TYPE: z.literal('GROUP'),
      DICT_GRP: groupName,
      DICT_PGRP: z.union([z.literal(''), groupName]),
      DICT_DESC: z.string(),
    }),
    z.object({
      DICT_TYPE: z.literal('HEADING'),
      DICT_GRP: groupName,
      DICT_HDNG: z.string().regex(/^[A-Z0-9_]{1,9}$/, 'at most 9 upper-case letters, digits or _'),
      DICT_STAT: status,
      DICT_DTYP: z.string().regex(knownTypes, 'not an AGS4 data type'),
      DICT_UNIT: z.string(),
    }),
  ],
  { error: 'GROUP or HEADING' },
)
const needed = ['DICT_TYPE', 'DICT_GRP', 'DICT_HDNG', 'DICT_STAT', 'DICT_DTYP'] as const

/**
 * Reads an AGS4 standard dictionary as the AGS publishes each edition: an AGS4 file whose DICT
 * group lists every standard group (DICT_TYPE GROUP, with DICT_PGRP its parent and DICT_DESC its
 * title) and, in order, each group's headings (HEADING, with status, data type and unit).
 * Descriptions and examples of headings are not kept. Throws DictionaryFileError naming each line.
 */
export function readDictionaryFile(text: string): DictionaryFile {
  const { groups: parsed, issues } = parseAgs(text)
  const dict = parsed.find((g) => g.name === 'DICT')
  if (!dict)
    throw new DictionaryFileError([
      { message: 'the file has no DICT group: it is not an AGS4 standard dictionary' },
    ])
  const missing = needed.filter((h) => !dict.headings.includes(h))
  if (missing.length)
    throw new DictionaryFileError(
      missing.map((h) => ({
        line: dict.headingLine,
        field: h,
        message: `DICT has no ${h} heading`,
      })),
    )
  const last = dict.data.at(-1)?.line ?? dict.typeLine
  // A fault of quoting, separators or field counts inside DICT would shift its fields.
  const problems: DictionaryFileProblem[] = issues
    .filter((i) => ['2b', '3', '4', '5', '6'].includes(i.rule))
    .filter((i) => i.line >= dict.line && i.line <= last)
    .map((i) => ({ line: i.line, message: i.message }))
  const groups = readRows(dict, problems)
  if (!problems.length && !groups.length)
    problems.push({
      line: dict.line,
      field: 'DICT_TYPE',
      message: 'DICT has no GROUP or HEADING rows: the file is not an AGS4 standard dictionary',
    })
  if (problems.length) throw new DictionaryFileError(shown(problems))
  const edition = declaredEdition(parsed)
  return {
    edition: edition ? { value: edition, line: editionLine(parsed) } : null,
    groups,
    headingCount: groups.reduce((n, g) => n + g.headings.length, 0),
  }
}

function readRows(dict: ParsedGroup, problems: DictionaryFileProblem[]): StandardGroup[] {
  const groups = new Map<string, StandardGroup & { line: number }>()
  const headingRows: {
    line: number
    row: Extract<z.output<typeof DictRow>, { DICT_TYPE: 'HEADING' }>
  }[] = []
  for (const { line, fields } of dict.data) {
    const raw = Object.fromEntries(dict.headings.map((h, i) => [h, fields[i] ?? '']))
    raw.DICT_PGRP ??= ''
    raw.DICT_DESC ??= ''
    raw.DICT_UNIT ??= ''
    const row = DictRow.safeParse(raw)
    if (!row.success) {
      for (const issue of row.error.issues) {
        const field = String(issue.path[0] ?? 'DICT_TYPE')
        problems.push({ line, field, message: `${field} "${raw[field] ?? ''}": ${issue.message}` })
      }
      continue
    }
    const r = row.data
    if (r.DICT_TYPE === 'HEADING') headingRows.push({ line, row: r })
    else if (groups.has(r.DICT_GRP))
      problems.push({
        line,
        field: 'DICT_GRP',
        message: `group ${r.DICT_GRP} is defined twice (first at line ${groups.get(r.DICT_GRP)!.line})`,
      })
    else
      groups.set(r.DICT_GRP, {
        name: r.DICT_GRP,
        parent: r.DICT_PGRP || undefined,
        title: r.DICT_DESC,
        headings: [],
        line,
      })
  }
  for (const { line, row } of headingRows) {
    const g = groups.get(row.DICT_GRP)
    if (!g) {
      problems.push({
        line,
        field: 'DICT_GRP',
        message: `no GROUP row defines group ${row.DICT_GRP}`,
      })
      continue
    }
    if (g.headings.some((h) => h.name === row.DICT_HDNG)) {
      problems.push({
        line,
        field: 'DICT_HDNG',
        message: `${row.DICT_HDNG} is listed twice in ${g.name}`,
      })
      continue
    }
    g.headings.push({
      name: row.DICT_HDNG,
      status: row.DICT_STAT,
      type: row.DICT_DTYP,
      unit: row.DICT_UNIT,
    })
  }
  for (const g of groups.values()) {
    if (!g.headings.length)
      problems.push({
        line: g.line,
        field: 'DICT_GRP',
        message: `group ${g.name} has no HEADING rows`,
      })
    if (g.parent && !groups.has(g.parent))
      problems.push({
        line: g.line,
        field: 'DICT_PGRP',
        message: `the parent group ${g.parent} of ${g.name} is not defined in the file`,
      })
  }
  return [...groups.values()].map(({ line: _line, ...g }) => g)
}

function editionLine(groups: ParsedGroup[]): number {
  return groups.find((g) => g.name === 'TRAN')?.data[0]?.line ?? 1
}

function shown(problems: DictionaryFileProblem[]): DictionaryFileProblem[] {
  if (problems.length <= SHOWN) return problems
  return [
    ...problems.slice(0, SHOWN),
    { message: `and ${problems.length - SHOWN} more problems of the same kind` },
  ]
}

/** An edition as TRAN_AGS or the upload gives it: 4.0.4, 4.1, 4.1.1. */
export const isEditionForm = (edition: string) => AGS_EDITION_FORM.test(edition)
