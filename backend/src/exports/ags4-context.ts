import type { ParsedGroup, Report } from './ags4-parse'
import {
  standardHeadingAnywhere,
  type AgsStatus,
  type StandardDictionary,
  type StandardGroup,
} from './ags4-standard'
import { uncheckedSink, type UncheckedSink } from './ags4-unchecked'

/** A heading as the file must honour it: from the standard dictionary or from its DICT group. */
export interface HeadingDef {
  name: string
  status: AgsStatus
  type: string
  unit: string
  /** standard: the dictionary's own heading of this group; dict: declared in DICT; borrowed: a
   * standard heading of another group carried by a user-defined group (e.g. LOCA_ID). */
  source: 'standard' | 'dict' | 'borrowed'
}

export interface GroupDef {
  name: string
  parent: string | undefined
  standard: boolean
  headings: HeadingDef[]
}

/** Everything the rules look up, built once per file. */
export interface AgsContext {
  groups: ParsedGroup[]
  byName: Map<string, ParsedGroup>
  report: Report
  dictionary: StandardDictionary
  /** A loaded edition: a group or heading it lacks is not standard. */
  complete: boolean
  standard: ReadonlyMap<string, StandardGroup>
  /** Standard groups, then the user-defined groups of DICT, with DICT's headings appended. */
  defs: Map<string, GroupDef>
  heading: (group: string, heading: string) => HeadingDef | undefined
  /**
   * Whether a heading `heading` leaves undefined is settled as no heading of the group: always
   * with a loaded dictionary; with the built-in groups only where DICT defines the whole group.
   */
  settled: (group: string, heading: string) => boolean
  /** What the dictionary in use could not settle, said instead of passed. */
  unchecked: UncheckedSink
  /** The values of one heading of one group, with their lines. */
  column: (group: string, heading: string) => { value: string; line: number }[]
  units: Set<string>
  types: Set<string>
  abbr: Map<string, Set<string>>
  fileSets: Set<string>
  /** TRAN_DLIM (Rule 11a) and TRAN_RCON (Rule 16a), their defaults where left empty. */
  delimiter: string
  concatenator: string
}

const statusOf = (text: string): AgsStatus => {
  const s = text.toUpperCase()
  const key = s.includes('KEY')
  const required = s.includes('REQUIRED')
  return key && required ? 'KEY+REQUIRED' : key ? 'KEY' : required ? 'REQUIRED' : 'OTHER'
}

export function buildContext(
  groups: ParsedGroup[],
  report: Report,
  dictionary: StandardDictionary,
): AgsContext {
  const byName = new Map<string, ParsedGroup>()
  for (const g of groups) if (!byName.has(g.name)) byName.set(g.name, g)
  const column = (group: string, heading: string) => {
    const g = byName.get(group)
    const i = g?.headings.indexOf(heading) ?? -1
    return g && i >= 0 ? g.data.map((r) => ({ value: r.fields[i] ?? '', line: r.line })) : []
  }
  const complete = dictionary.source === 'loaded'
  const defs = new Map<string, GroupDef>()
  for (const s of dictionary.groups.values())
    defs.set(s.name, {
      name: s.name,
      parent: s.parent,
      standard: true,
      headings: s.headings.map((h) => ({ ...h, source: 'standard' })),
    })
  readDict(byName, defs)
  const heading = (group: string, name: string): HeadingDef | undefined => {
    const def = defs.get(group)
    if (!def) return undefined
    const own = def.headings.find((h) => h.name === name)
    if (own || def.standard) return own
    // From memory of Rule 19b: a user-defined group may carry a standard heading of another
    // group under that heading's own name, defined where the dictionary defines it.
    const home = standardHeadingAnywhere(dictionary, name)
    return home && { ...home, source: 'borrowed' }
  }
  const settled = (group: string, name: string): boolean => {
    if (complete) return true
    const def = defs.get(group)
    if (!def || def.standard) return false
    // A user-defined group's own headings are all in DICT; one named after another group is
    // settled only where DICT defines that group too.
    const prefix = name.slice(0, 4)
    return prefix === group || defs.get(prefix)?.standard === false
  }
  const abbr = new Map<string, Set<string>>()
  const codes = column('ABBR', 'ABBR_CODE')
  column('ABBR', 'ABBR_HDNG').forEach(({ value }, i) => {
    if (!abbr.has(value)) abbr.set(value, new Set())
    abbr.get(value)!.add(codes[i]?.value ?? '')
  })
  return {
    groups,
    byName,
    report,
    dictionary,
    complete,
    standard: dictionary.groups,
    defs,
    heading,
    settled,
    unchecked: uncheckedSink(),
    column,
    units: new Set(column('UNIT', 'UNIT_UNIT').map((c) => c.value)),
    types: new Set(column('TYPE', 'TYPE_TYPE').map((c) => c.value)),
    abbr,
    fileSets: new Set(column('FILE', 'FILE_FSET').map((c) => c.value)),
    delimiter: column('TRAN', 'TRAN_DLIM')[0]?.value || '|',
    concatenator: column('TRAN', 'TRAN_RCON')[0]?.value || '+',
  }
}

/** DICT rows as definitions: user-defined groups and the headings added to any group. */
function readDict(byName: Map<string, ParsedGroup>, defs: Map<string, GroupDef>) {
  const dict = byName.get('DICT')
  if (!dict) return
  const at = (row: string[], h: string) => row[dict.headings.indexOf(h)] ?? ''
  for (const { fields } of dict.data) {
    const group = at(fields, 'DICT_GRP')
    if (at(fields, 'DICT_TYPE') === 'GROUP' && !defs.has(group))
      defs.set(group, {
        name: group,
        parent: at(fields, 'DICT_PGRP') || undefined,
        standard: false,
        headings: [],
      })
  }
  for (const { fields } of dict.data) {
    const def = defs.get(at(fields, 'DICT_GRP'))
    const name = at(fields, 'DICT_HDNG')
    if (at(fields, 'DICT_TYPE') !== 'HEADING' || !def || def.headings.some((h) => h.name === name))
      continue
    def.headings.push({
      name,
      status: statusOf(at(fields, 'DICT_STAT')),
      type: at(fields, 'DICT_DTYP'),
      unit: at(fields, 'DICT_UNIT'),
      source: 'dict',
    })
  }
}
