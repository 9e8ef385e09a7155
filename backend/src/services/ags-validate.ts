import type { Executor } from '../db/client'
import { decodeAgsBytes } from '../exports/ags4-bytes'
import { parseAgs } from '../exports/ags4-parse'
import {
  checkParsedAgs,
  declaredEdition,
  type AgsCheck,
  type AgsIssue,
  type Unchecked,
} from '../exports/ags4-validate'
import { loadedDictionary } from './ags-dictionaries'

/** Findings sent back in full; past this many the counts per rule still cover the whole file. */
export const FINDINGS_SHOWN = 1000

export interface AgsFileCheck {
  fileName: string
  bytes: number
  edition: string | null
  /** The dictionary used: the declared edition's loaded one, else the built-in groups. */
  dictionary: AgsCheck['dictionary']
  errors: number
  warnings: number
  /** Findings per rule over the whole file, in rule order. */
  byRule: { rule: string; errors: number; warnings: number }[]
  findings: AgsIssue[]
  truncated: boolean
  /** What the built-in groups could not settle: empty with a loaded dictionary. */
  unchecked: Unchecked[]
  notes: string[]
  groups: { name: string; line: number; rows: number }[]
}

const ruleOrder = (a: string, b: string) => parseInt(a) - parseInt(b) || a.localeCompare(b)

/**
 * Checks an AGS4 file received from anyone against Rules 1–20 and the standard dictionary of the
 * edition it declares where one is loaded (else the groups Downdip writes): the findings by rule
 * and line, counts per rule, and what could not be checked. Nothing is stored.
 */
export async function checkAgsFile(
  db: Executor,
  file: { name: string; buffer: Buffer },
): Promise<AgsFileCheck> {
  const { text, note } = decodeAgsBytes(file.buffer)
  const parsed = parseAgs(text)
  const check = checkParsedAgs(parsed, await loadedDictionary(db, declaredEdition(parsed.groups)))
  const counts = new Map<string, { rule: string; errors: number; warnings: number }>()
  for (const i of check.issues) {
    const c = counts.get(i.rule) ?? { rule: i.rule, errors: 0, warnings: 0 }
    if (i.severity === 'error') c.errors++
    else c.warnings++
    counts.set(i.rule, c)
  }
  const byRule = [...counts.values()].sort((a, b) => ruleOrder(a.rule, b.rule))
  return {
    fileName: file.name,
    bytes: file.buffer.length,
    edition: check.edition,
    dictionary: check.dictionary,
    errors: byRule.reduce((n, c) => n + c.errors, 0),
    warnings: byRule.reduce((n, c) => n + c.warnings, 0),
    byRule,
    findings: check.issues.slice(0, FINDINGS_SHOWN),
    truncated: check.issues.length > FINDINGS_SHOWN,
    unchecked: check.unchecked,
    notes: note ? [note, ...check.notes] : check.notes,
    groups: check.groups,
  }
}
