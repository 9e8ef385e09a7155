import { describe, expect, it } from 'vitest'
import { checkAgs } from '../../backend/src/exports/ags4-validate'
import {
  dropGroup,
  edit,
  findings,
  lab,
  lineOf,
  messages,
  site,
  testDictionary,
} from './ags4-files'

// Rules 10c, 11, 13, 14 and 20, each broken once in a valid file of our own; parent groups as
// the AGS 4.1.1 dictionary names them (SAMP under LOCA, WSTD under WSTG), our test subset of it
// loaded. Rule texts from memory.
describe('checkAgs() parents and record links: Rules 10c, 11', () => {
  it('checkAgs() Rule 10c: a SAMP row of a hole LOCA does not hold', () => {
    const text = edit(site, '"GSQ-BH06","8.00","1","C"', '"GSQ-BH09","8.00","1","C"')
    expect(findings(text)).toEqual([`10c@${lineOf(text, '"GSQ-BH09"')}`])
    expect(messages(text)).toEqual(['Rule 10c: no LOCA row has LOCA_ID "GSQ-BH09"'])
  })

  it('checkAgs() Rule 10c: a child group whose parent group is missing (WSTD without WSTG)', () => {
    const text = dropGroup(site, 'WSTG')
    expect(findings(text)).toEqual([`10c@${lineOf(text, '"GROUP","WSTD"')}`])
  })

  it('checkAgs() Rule 10c: a LNMC specimen with no SAMP row on all shared KEY fields', () => {
    const text = edit(
      site,
      '"DATA","GSQ-BH05","1.50","1","B","GSQ05-001","1","1.60"',
      '"DATA","GSQ-BH05","1.50","9","B","GSQ05-001","1","1.60"',
    )
    expect(messages(text)).toEqual([
      'Rule 10c: no SAMP row has LOCA_ID "GSQ-BH05", SAMP_TOP "1.50", SAMP_REF "9", SAMP_TYPE "B", SAMP_ID "GSQ05-001"',
    ])
  })

  it('checkAgs() Rule 11: record links (RL) with no delimiter, too few KEY values, no such row or group', () => {
    const link = '"LOCA|GSQ-BH05"'
    const none = edit(lab, link, '"LOCA GSQ-BH05"')
    expect(findings(none)).toEqual([`11a@${lineOf(none, 'LOCA GSQ-BH05')}`])
    const few = edit(lab, 'SAMP|GSQ-BH05|1.50|1|B|GSQ05-001+', 'SAMP|GSQ-BH05|1.50+')
    expect(findings(few)).toEqual([`11b@${lineOf(few, 'SAMP|GSQ-BH05|1.50+')}`])
    expect(messages(few)[0]).toBe(
      'Rule 11b: SAMP_LINK "SAMP|GSQ-BH05|1.50" gives 2 KEY values; SAMP has 5 (LOCA_ID, SAMP_TOP, SAMP_REF, SAMP_TYPE, SAMP_ID)',
    )
    const row = edit(lab, link, '"LOCA|GSQ-BH07"')
    expect(findings(row)).toEqual([`11c@${lineOf(row, 'GSQ-BH07')}`])
    const group = edit(lab, link, '"MONG|GSQ-BH05|P1|33.00"')
    expect(messages(group)).toEqual([
      'Rule 11c: SAMP_LINK "MONG|GSQ-BH05|P1|33.00" links to group MONG, which the file does not hold',
    ])
  })

  it('checkAgs() Rule 11a: TRAN_DLIM of two characters', () => {
    const text = edit(site, '"Greyscar Aggregates","|","+"', '"Greyscar Aggregates","||","+"')
    expect(findings(text)).toEqual([`11a@${lineOf(text, '"||"')}`])
  })
})

describe('checkAgs() the file: Rules 13, 14, 20', () => {
  it('checkAgs() Rule 13: no PROJ group; two PROJ rows', () => {
    expect(findings(dropGroup(site, 'PROJ'))).toEqual(['13@1'])
    const two = edit(
      site,
      '"Downdip demo team"\r\n',
      '"Downdip demo team"\r\n"DATA","GSQ2","Second","","",""\r\n',
    )
    expect(findings(two)).toEqual(['13@1'])
    expect(messages(two)).toEqual(['Rule 13: PROJ has 2 DATA rows; it must have exactly one'])
  })

  it('checkAgs() Rule 14: no TRAN group; an edition that is no AGS4 edition (warning)', () => {
    expect(findings(dropGroup(site, 'TRAN'))).toEqual(['14@1'])
    const edition = edit(site, '"4.1.1","Greyscar Aggregates"', '"3.1","Greyscar Aggregates"')
    expect(findings(edition)).toEqual([])
    expect(findings(edition, true)).toEqual([`14@${lineOf(edition, '"3.1"')}`])
    expect(checkAgs(edition).notes[0]).toBe(
      "The file declares no known AGS4 edition: groups and headings were checked against the groups Downdip writes, as AGS 4.1.1 defines them, and the file's own DICT group.",
    )
    expect(checkAgs(edition).unchecked[0].message).toContain(
      'the file names no AGS4 edition whose standard dictionary could be loaded',
    )
  })

  it('checkAgs() another edition without its dictionary: the built-in groups, and it says so', () => {
    const text = edit(site, '"4.1.1","Greyscar Aggregates"', '"4.0.4","Greyscar Aggregates"')
    expect(findings(text, true)).toEqual([])
    const check = checkAgs(text)
    expect(check).toMatchObject({
      edition: '4.0.4',
      dictionary: { edition: '4.1.1', source: 'built-in' },
    })
    expect(check.notes[0]).toBe(
      "The file declares AGS 4.0.4, whose standard dictionary is not loaded: groups and headings were checked against the groups Downdip writes, as AGS 4.1.1 defines them, and the file's own DICT group.",
    )
    expect(check.unchecked.find((u) => u.group === 'GEOL')?.message).toBe(
      'Rule 9: group GEOL is not in the groups Downdip knows and the 4.0.4 standard dictionary is not loaded: ask an administrator to load it. Its headings, their order, KEY and REQUIRED fields and parent rows were not checked.',
    )
  })

  it('checkAgs() Rule 20: a FILE_FSET with no FILE row; no FILE group; what cannot be checked is said', () => {
    const other = edit(site, '"GSQGRID","212.40","45.00","FS1"', '"GSQGRID","212.40","45.00","FS2"')
    expect(findings(other)).toEqual([`20@${lineOf(other, '"FS2"')}`])
    const none = dropGroup(site, 'FILE')
    expect(messages(none)).toEqual([
      'Rule 20: FILE_FSET "FS1" has no row in the FILE group (the file has no FILE group)',
    ])
    expect(checkAgs(site, testDictionary).notes).toEqual([
      'Rule 20: whether each FILE_FSET folder and FILE_NAME exists beside the .ags file (FILE/<FILE_FSET>/<FILE_NAME>) cannot be checked from the file alone.',
    ])
  })
})
