import { describe, expect, it } from 'vitest'
import { checkAgs } from '../../backend/src/exports/ags4-validate'
import {
  edit,
  lab,
  lineOf,
  monitoring,
  moveColumn,
  readAgs,
  site,
  swapColumns,
  testDictionary,
} from './ags4-files'

// No standard dictionary loaded: the built-in groups (those Downdip writes, as AGS 4.1.1 defines
// them) and the file's own DICT. What they cannot settle is listed as unchecked, by rule, group
// and line, never passed; what they can settle is still found.
const unchecked = (text: string) =>
  checkAgs(text).unchecked.map((u) => `${u.rule}@${u.line} ${u.group}`)
const errors = (text: string, dictionary = undefined as typeof testDictionary | undefined) =>
  checkAgs(text, dictionary).issues.map((i) => `${i.rule}@${i.line}`)
const missing = 'the 4.1.1 standard dictionary is not loaded: ask an administrator to load it'

describe('checkAgs() without a loaded dictionary: what cannot be checked is said', () => {
  it('checkAgs() site file: no finding; each group and heading beyond ours listed as unchecked', () => {
    const check = checkAgs(site)
    expect(check.issues).toEqual([])
    expect(check.dictionary).toEqual({ edition: '4.1.1', source: 'built-in' })
    expect(unchecked(site)).toEqual([
      '9@2 PROJ',
      '9@38 ABBR',
      '9@53 LOCA',
      '9@59 GEOL',
      '9@67 SAMP',
      '9@75 ISPT',
      '9@82 LNMC',
      '9@88 WSTG',
      '9@94 WSTD',
      '9@101 FILE',
    ])
    expect(check.unchecked.find((u) => u.group === 'GEOL')!.message).toBe(
      `Rule 9: group GEOL is not in the groups Downdip knows and ${missing}. Its headings, their order, KEY and REQUIRED fields and parent rows were not checked.`,
    )
    expect(check.unchecked[0].message).toBe(
      `Rule 9: headings PROJ_LOC, PROJ_CLNT, PROJ_ENG of PROJ are not among the headings Downdip knows and ${missing}. Their definition, order and name were not checked.`,
    )
  })

  it('checkAgs() lab and monitoring files: parents and record links it cannot match are listed', () => {
    expect(errors(lab)).toEqual([])
    expect(unchecked(lab)).toContain('11@86 SAMP')
    expect(unchecked(lab)).toContain('10c@121 GSQC')
    expect(checkAgs(lab).unchecked.find((u) => u.rule === '10c')!.message).toBe(
      `Rule 10c: rows of GSQC were not matched to their parent group SAMP: Downdip does not know the KEY headings of SAMP and ${missing}.`,
    )
    expect(errors(monitoring)).toEqual([])
    expect(unchecked(monitoring)).toEqual([
      '9@14 UNIT',
      '9@80 LOCA',
      '9@85 HDPH',
      '9@92 CORE',
      '9@98 PIPE',
      '9@105 MONG',
      '9@112 MOND',
      '10c@120 GSQV',
      '19b@121 GSQV',
      '9@126 FGHG',
    ])
  })

  it('checkAgs() with the test dictionary loaded the same files leave nothing unchecked', () => {
    for (const text of [site, lab, monitoring])
      expect(checkAgs(text, testDictionary).unchecked).toEqual([])
  })

  it('checkAgs() the broken file: the faults in our groups are still found; the one in SAMP only with the dictionary', () => {
    const broken = readAgs('broken/gsq-site-three-faults.ags')
    expect(errors(broken)).toEqual(['10b@11', '7@53'])
    expect(unchecked(broken)).toContain('9@67 SAMP')
    expect(errors(broken, testDictionary)).toEqual(['10b@11', '7@53', '10c@73'])
  })
})

describe('checkAgs() without a loaded dictionary: what can be settled is still found', () => {
  it('checkAgs() Rule 8 in a group it does not know: the file gives the TYPE', () => {
    const text = edit(site, '"GSQ-BH05","0.00","6.20"', '"GSQ-BH05","0.0","6.20"')
    expect(errors(text)).toEqual([`8@${lineOf(text, '"0.0","6.20"')}`])
  })

  it('checkAgs() Rule 9: a heading of a user-defined group that DICT does not define', () => {
    const text = edit(
      edit(
        edit(monitoring, '"GSQV_PPV","GSQV_FREQ"', '"GSQV_PPV","GSQV_FREQ","GSQV_NOTE"'),
        '"UNIT","","","m","","mm/s",""',
        '"UNIT","","","m","","mm/s","",""',
      ),
      '"4.80","22"',
      '"4.80","22",""',
    )
    expect(
      errors(
        edit(
          text,
          '"TYPE","ID","X","2DP","X","2DP","0DP"',
          '"TYPE","ID","X","2DP","X","2DP","0DP","X"',
        ),
      ),
    ).toEqual([`9@${lineOf(text, 'GSQV_NOTE')}`])
  })

  it('checkAgs() Rule 7: order among the headings it knows is checked; one it does not know is passed over, and listed', () => {
    const swapped = swapColumns(site, 'LOCA', 'LOCA_GREF', 'LOCA_GL')
    expect(errors(swapped)).toEqual([`7@${lineOf(swapped, '"HEADING","LOCA_ID"')}`])
    // FILE_FSET moved before LOCA_GREF: not a heading Downdip knows, so its place is unsettled
    const moved = moveColumn(site, 'LOCA', 'FILE_FSET', 'LOCA_GREF')
    expect(moved).toContain('"LOCA_NATN","FILE_FSET","LOCA_GREF"')
    expect(errors(moved)).toEqual([])
    expect(unchecked(moved)).toContain(`9@${lineOf(moved, '"HEADING","LOCA_ID"')} LOCA`)
    expect(errors(moved, testDictionary)).toEqual([`7@${lineOf(moved, '"HEADING","LOCA_ID"')}`])
  })

  it('checkAgs() Rule 19b: DICT headings named after a group it does not know are listed; with the dictionary a wrong one is an error', () => {
    const text = monitoring.replace(/GSQV_FREQ/g, 'MONX_FREQ')
    const heading = lineOf(text, '"GSQV_PPV","MONX_FREQ"')
    expect(errors(text)).toEqual([])
    expect(checkAgs(text).unchecked.find((u) => u.rule === '19b')).toEqual({
      rule: '19b',
      group: 'GSQV',
      line: heading,
      // MONG_ID and MONG_DIS (KEY headings of MONG, a group Downdip does not know) with it
      message: `Rule 19b: headings MONG_ID, MONG_DIS, MONX_FREQ of GSQV do not start with GSQV_ and are not among the headings Downdip knows, and ${missing}: whether they repeat standard headings of another group was not checked.`,
    })
    expect(errors(text, testDictionary)).toEqual([`19b@${heading}`])
  })

  it('checkAgs() Rule 9 and 18 with the dictionary: a group in neither the dictionary nor DICT is an error', () => {
    const text = edit(site, '"GROUP","WSTD"', '"GROUP","WSTX"')
    expect(errors(text)).toEqual([])
    expect(unchecked(text)).toContain(`9@${lineOf(text, 'WSTX')} WSTX`)
    expect(errors(text, testDictionary)).toEqual([`9@${lineOf(text, 'WSTX')}`])
  })
})
