import { buildContext, type AgsContext } from './ags4-context'
import { issueSink, parseAgs, type AgsIssue, type ParsedGroup } from './ags4-parse'
import { checkData } from './ags4-rules-data'
import { checkFile } from './ags4-rules-file'
import { checkParents, checkRecordLinks } from './ags4-rules-links'
import { checkNames } from './ags4-rules-names'
import { AGS_EDITION_FORM } from '../../../schema/ags'
import { builtInDictionary, type StandardDictionary } from './ags4-standard'
import { describeUnchecked, type Unchecked } from './ags4-unchecked'

export type { AgsIssue } from './ags4-parse'
export type { Unchecked } from './ags4-unchecked'
export { AGS_EDITIONS } from './ags4-standard'

export interface AgsCheck {
  /** TRAN_AGS as the file gives it. */
  edition: string | null
  /** The dictionary the groups and headings were checked against. */
  dictionary: { edition: string; source: StandardDictionary['source'] }
  issues: AgsIssue[]
  /** What the dictionary in use could not settle (built-in groups only), by group and line. */
  unchecked: Unchecked[]
  /** What the check could not settle from the file alone. */
  notes: string[]
  groups: { name: string; line: number; rows: number }[]
}

/** TRAN_AGS of parsed groups: the edition whose dictionary the file asks to be checked by. */
export function declaredEdition(groups: ParsedGroup[]): string | null {
  const tran = groups.find((g) => g.name === 'TRAN')
  const i = tran?.headings.indexOf('TRAN_AGS') ?? -1
  return (i >= 0 && tran?.data[0]?.fields[i]) || null
}

/**
 * Checks AGS4 text against Rules 1–20 of the AGS4 data format, every finding with its rule and
 * line, using `dictionary`: the declared edition's loaded dictionary where the caller has one,
 * else the groups Downdip writes, with what they cannot settle listed as unchecked.
 */
export function checkAgs(text: string, dictionary?: StandardDictionary): AgsCheck {
  return checkParsedAgs(parseAgs(text), dictionary)
}

export function checkParsedAgs(
  parsed: { groups: ParsedGroup[]; issues: AgsIssue[] },
  dictionary: StandardDictionary = builtInDictionary(),
): AgsCheck {
  const { groups } = parsed
  const issues = [...parsed.issues]
  const ctx = buildContext(groups, issueSink(issues), dictionary)
  checkFile(ctx)
  checkNames(ctx)
  checkData(ctx)
  checkParents(ctx)
  checkRecordLinks(ctx)
  const edition = declaredEdition(groups)
  issues.sort(
    (a, b) =>
      a.line - b.line || parseInt(a.rule) - parseInt(b.rule) || a.rule.localeCompare(b.rule),
  )
  return {
    edition,
    dictionary: { edition: dictionary.edition, source: dictionary.source },
    issues,
    unchecked: describeUnchecked(ctx.unchecked.items(), edition),
    notes: notesOf(ctx, edition),
    groups: groups.map((g) => ({ name: g.name, line: g.line, rows: g.data.length })),
  }
}

function notesOf(ctx: AgsContext, edition: string | null): string[] {
  const notes: string[] = []
  const used = ctx.dictionary.edition
  if (ctx.dictionary.source === 'built-in')
    notes.push(
      (edition && AGS_EDITION_FORM.test(edition)
        ? edition === used
          ? `The AGS ${edition} standard dictionary is not loaded`
          : `The file declares AGS ${edition}, whose standard dictionary is not loaded`
        : 'The file declares no known AGS4 edition') +
        `: groups and headings were checked against the groups Downdip writes, as AGS ${used} defines them, and the file's own DICT group.`,
    )
  if (ctx.byName.has('FILE') || ctx.groups.some((g) => g.headings.includes('FILE_FSET')))
    notes.push(
      'Rule 20: whether each FILE_FSET folder and FILE_NAME exists beside the .ags file (FILE/<FILE_FSET>/<FILE_NAME>) cannot be checked from the file alone.',
    )
  return notes
}

/** Every finding (errors and warnings) of checkAgs, in line order. */
export function validateAgs(text: string, dictionary?: StandardDictionary): AgsIssue[] {
  return checkAgs(text, dictionary).issues
}
