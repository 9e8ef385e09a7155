import { describe, expect, it } from 'vitest'
import { checkAgs } from '../../backend/src/exports/ags4-validate'
import { dropColumn, edit, findings, lineOf, messages, site, testDictionary } from './ags4-files'

// Each case breaks one rule of the file's form in a valid file of our own and expects that rule,
// on that line, and nothing else. Rule numbers and wording: AGS4 data format rules 1-6 (from
// memory of the AGS4 rules text; the numbering as the AGS publishes it).
describe('checkAgs() file form: Rules 1-6', () => {
  it('checkAgs() Rule 1: a non-ASCII character, and a byte-order mark, are found by line', () => {
    const text = edit(site, 'north wall extension', 'north wall extensión')
    expect(findings(text)).toEqual([`1@${lineOf(text, 'extensión')}`])
    expect(messages(text)[0]).toBe('Rule 1: non-ASCII character "ó" at column 49')
    expect(findings(`\ufeff${site}`)).toEqual(['1@1'])
  })

  it('checkAgs() Rule 2a: LF-only line ends on every line; one LF; no CR LF on the last line', () => {
    const lf = site.replace(/\r\n/g, '\n')
    const lines = site.split('\r\n').length - 1
    expect(findings(lf)).toEqual(Array.from({ length: lines }, (_, i) => `2a@${i + 1}`))
    expect(findings(site.replace('\r\n', '\n'))).toEqual(['2a@1'])
    expect(findings(site.slice(0, -2))).toEqual([`2a@${lines}`])
  })

  it('checkAgs() Rule 2: a group with no DATA rows; a GROUP row with no blank line before it (warning)', () => {
    const rows = '"DATA","GSQ-BH05","4.10","5","3.95"\r\n"DATA","GSQ-BH05","4.10","20","3.60"\r\n'
    const empty = edit(site, rows, '')
    expect(findings(empty)).toEqual([`2@${lineOf(empty, '"GROUP","WSTD"')}`])
    expect(messages(empty)).toEqual(['Rule 2: group WSTD has no DATA rows'])
    const joined = edit(site, 'limestone contact"\r\n\r\n', 'limestone contact"\r\n')
    expect(findings(joined)).toEqual([])
    expect(findings(joined, true)).toEqual([`2@${lineOf(joined, '"GROUP","WSTD"')}`])
  })

  it('checkAgs() Rule 2b: UNIT row missing; a DATA row outside any group; HEADING twice', () => {
    const noUnit = edit(
      site,
      '"UNIT","","m","m","",""\r\n"TYPE","ID","2DP","2DP","X","PA"',
      '"TYPE","ID","2DP","2DP","X","PA"',
    )
    const geol = lineOf(noUnit, '"GROUP","GEOL"')
    expect(findings(noUnit)).toEqual([`2b@${geol}`, `2b@${geol + 2}`])
    expect(messages(noUnit)).toEqual([
      'Rule 2b: group GEOL has no UNIT row',
      'Rule 2b: TYPE row before the UNIT row of group GEOL',
    ])
    const stray = edit(site, '"GROUP","GEOL"', '"DATA","GSQ-BH05"\r\n\r\n"GROUP","GEOL"')
    expect(findings(stray)).toEqual([`2b@${lineOf(stray, '"DATA","GSQ-BH05"\r')}`])
    const twice = edit(
      site,
      '"HEADING","LOCA_ID","GEOL_TOP"',
      '"HEADING","LOCA_ID","GEOL_TOP","GEOL_BASE","GEOL_DESC","GEOL_LEG"\r\n"HEADING","LOCA_ID","GEOL_TOP"',
    )
    expect(findings(twice)).toEqual([`2b@${lineOf(twice, '"GROUP","GEOL"') + 2}`])
  })

  it('checkAgs() Rule 3: a line that starts with no data descriptor', () => {
    const text = edit(
      site,
      '"DATA","GSQ-BH05","0.00","6.20"',
      '"NOTE","drillers log"\r\n"DATA","GSQ-BH05","0.00","6.20"',
    )
    expect(findings(text)).toEqual([`3@${lineOf(text, '"NOTE"')}`])
  })

  it('checkAgs() Rule 4: a DATA row one field short; a GROUP row with three fields', () => {
    const short = edit(site, '"DATA","GSQ-BH05","4.10","5","3.95"', '"DATA","GSQ-BH05","4.10","5"')
    expect(findings(short)).toEqual([`4@${lineOf(short, '"4.10","5"\r')}`])
    expect(messages(short)).toEqual(['Rule 4: 4 fields where the HEADING row has 5'])
    const group = edit(site, '"GROUP","WSTD"', '"GROUP","WSTD","extra"')
    expect(findings(group)).toEqual([`4@${lineOf(group, '"WSTD","extra"')}`])
  })

  it('checkAgs() Rule 5: an unquoted field; a quote inside a field that is not doubled', () => {
    const bare = edit(
      site,
      '"DATA","GSQ-BH05","4.10","20","3.60"',
      '"DATA","GSQ-BH05","4.10",20,"3.60"',
    )
    expect(findings(bare)).toEqual([`5@${lineOf(bare, ',20,')}`])
    expect(messages(bare)).toEqual(['Rule 5: field 4 is not enclosed in double quotes'])
    const inner = edit(site, '"Slow inflow at the clay', '"Slow "inflow" at the clay')
    expect(findings(inner)).toEqual([`5@${lineOf(inner, 'Slow "inflow"')}`])
    // Doubled inner quotes are right and read back as one quote.
    const doubled = edit(site, '"Slow inflow at the clay', '"Slow ""inflow"" at the clay')
    expect(findings(doubled)).toEqual([])
    expect(checkAgs(doubled, testDictionary).groups.find((g) => g.name === 'WSTG')?.rows).toBe(1)
  })

  it('checkAgs() Rule 6: semicolons between fields are found, and the fields are still read', () => {
    const text = edit(
      site,
      '"DATA","GSQ-BH05","4.10","20","3.60"',
      '"DATA";"GSQ-BH05";"4.10";"20";"3.60"',
    )
    expect(findings(text)).toEqual([`6@${lineOf(text, ';"4.10"')}`])
    expect(messages(text)).toEqual(['Rule 6: field 1 is followed by ";", not a comma'])
  })

  it('checkAgs() Rule 2c: a heading twice in one HEADING row', () => {
    const text = edit(
      edit(site, '"GEOL_DESC","GEOL_LEG"', '"GEOL_DESC","GEOL_DESC"'),
      '"TYPE","ID","2DP","2DP","X","PA"',
      '"TYPE","ID","2DP","2DP","X","X"',
    )
    expect(findings(text)).toEqual([`2c@${lineOf(text, '"GEOL_DESC","GEOL_DESC"')}`])
  })

  it('dropColumn() keeps a valid file valid when the column is not KEY or REQUIRED', () => {
    expect(findings(dropColumn(site, 'GEOL', 'GEOL_LEG'))).toEqual([])
  })
})
