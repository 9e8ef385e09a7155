import { describe, expect, it } from 'vitest'
import { edit, findings, lab, lineOf, messages, monitoring, site, swapColumns } from './ags4-files'

// Rules 7, 9, 18, 19 and 2c against the AGS 4.1.1 standard dictionary (its group and heading
// definitions: our test subset of it loaded, testdata/ags4/dictionary); rule texts from memory
// of the AGS4 rules.
describe('checkAgs() names and order: Rules 7, 9, 18, 19', () => {
  it('checkAgs() Rule 7: LOCA_GL before LOCA_GREF (the 4.1.1 order is LOCA_GREF, LOCA_GL, LOCA_FDEP)', () => {
    const text = swapColumns(site, 'LOCA', 'LOCA_GREF', 'LOCA_GL')
    expect(findings(text)).toEqual([`7@${lineOf(text, '"HEADING","LOCA_ID"')}`])
    expect(messages(text)).toEqual([
      'Rule 7: LOCA_GREF comes after LOCA_GL; the dictionary order is LOCA_ID, LOCA_TYPE, LOCA_NATE, LOCA_NATN, LOCA_GREF, LOCA_GL, LOCA_FDEP, FILE_FSET',
    ])
  })

  it('checkAgs() Rule 7: a standard heading after a user-defined one', () => {
    const text = swapColumns(monitoring, 'MOND', 'MOND_LIM', 'MOND_BATT')
    expect(findings(text)).toEqual([
      `7@${lineOf(text, '"HEADING","LOCA_ID","MONG_ID","MONG_DIS","MOND_DTIM"')}`,
    ])
  })

  it('checkAgs() Rule 9: a heading and a group in neither the dictionary nor DICT', () => {
    const heading = edit(
      edit(site, '"GEOL_DESC","GEOL_LEG"', '"GEOL_DESC","GEOL_COLR"'),
      '"TYPE","ID","2DP","2DP","X","PA"',
      '"TYPE","ID","2DP","2DP","X","X"',
    )
    expect(findings(heading)).toEqual([`9@${lineOf(heading, 'GEOL_COLR')}`])
    expect(messages(heading)).toEqual([
      'Rule 9: heading GEOL_COLR is not a heading of GEOL in the standard dictionary and not defined in DICT',
    ])
    const group = edit(site, '"GROUP","WSTD"', '"GROUP","WSTX"')
    expect(findings(group)).toEqual([`9@${lineOf(group, 'WSTX')}`])
    expect(messages(group)[0]).toContain('(the file has no DICT group)')
  })

  it('checkAgs() Rule 18: a DICT HEADING row without its type; a DICT GROUP row without a parent', () => {
    const noType = edit(monitoring, '"MOND_BATT","OTHER","1DP"', '"MOND_BATT","OTHER",""')
    expect(findings(noType)).toEqual([`18@${lineOf(noType, '"MOND_BATT","OTHER",""')}`])
    expect(messages(noType)).toEqual(['Rule 18: a DICT HEADING row of MOND leaves DICT_DTYP empty'])
    const noParent = edit(
      monitoring,
      '"Blast vibration event per monitor","","MONG"',
      '"Blast vibration event per monitor","",""',
    )
    expect(findings(noParent)).toEqual([
      `18@${lineOf(noParent, 'Blast vibration event per monitor')}`,
    ])
  })

  it('checkAgs() Rule 18a: user-defined headings out of their DICT order', () => {
    const text = swapColumns(monitoring, 'GSQV', 'GSQV_PPV', 'GSQV_FREQ')
    expect(findings(text)).toEqual([
      `18a@${lineOf(text, '"HEADING","LOCA_ID","MONG_ID","MONG_DIS","GSQV_BLST"')}`,
    ])
  })

  it('checkAgs() Rule 19: a group name of five characters (its headings cannot then take its name)', () => {
    const text = monitoring.replace(/GSQV"/g, 'GSQV5"')
    const g = lineOf(text, '"GROUP","GSQV5"\r')
    expect(findings(text)).toEqual([`19@${g}`, `19b@${g + 1}`, `19b@${g + 1}`, `19b@${g + 1}`])
  })

  it('checkAgs() Rule 19a: a heading of ten characters', () => {
    const text = monitoring.replace(/MOND_BATT"/g, 'MOND_BATTV"')
    expect(findings(text)).toEqual([`19a@${lineOf(text, '"MOND_LIM","MOND_BATTV"')}`])
  })

  it('checkAgs() Rule 19b: a user-defined heading not named after its group', () => {
    const text = monitoring.replace(/MOND_BATT/g, 'MONX_BATT')
    expect(findings(text)).toEqual([`19b@${lineOf(text, '"MOND_LIM","MONX_BATT"')}`])
  })

  it('checkAgs() Rule 19b: standard headings carried in other groups pass (FRAC_SET in DISC, SAMP_* and SPEC_REF in a user-defined group)', () => {
    expect(findings(monitoring, true)).toEqual([])
    expect(findings(lab, true)).toEqual([])
    // A standard heading in a user-defined group is defined by the dictionary even without DICT.
    expect(
      findings(
        edit(lab, '"DATA","HEADING","GSQC","TEST_STAT","OTHER","X","Test status","","",""\r\n', ''),
        true,
      ),
    ).toEqual([])
  })
})
