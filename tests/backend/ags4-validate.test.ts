import { describe, expect, it } from 'vitest'
import { checkAgs, validateAgs } from '../../backend/src/exports/ags4-validate'
import { headingsOf, writeAgsTables } from '../../backend/src/exports/ags4-format'
import { dictionaryText, readAgs, testDictionary, validFiles } from './ags4-files'

// Valid AGS4 files of our own (testdata/ags4, the Greyscar Quarry scenario) with groups Downdip
// does not write: SAMP, GEOL, ISPT, LNMC, WSTG/WSTD, FILE; GRAG/GRAT, LLPL, RPLT, RUCS and
// record links; HDPH, PIPE, MONG/MOND with PU units, a DICT group and a user-defined group.
// Checked with our test subset of the AGS 4.1.1 standard dictionary loaded.
describe('checkAgs() valid files of other groups', () => {
  it.each(validFiles)(
    'checkAgs() %s → no finding, not even a warning, nothing unchecked',
    (name) => {
      const check = checkAgs(readAgs(name), testDictionary)
      expect(check.issues).toEqual([])
      expect(check.unchecked).toEqual([])
      expect(check).toMatchObject({
        edition: '4.1.1',
        dictionary: { edition: '4.1.1', source: 'loaded' },
      })
    },
  )

  it('checkAgs() the test dictionary file is itself a valid AGS4 file by its own definitions', () => {
    const check = checkAgs(dictionaryText, testDictionary)
    expect(check.issues).toEqual([])
    expect(check.groups.map((g) => [g.name, g.rows])).toEqual([
      ['PROJ', 1],
      ['TRAN', 1],
      ['UNIT', 14],
      ['TYPE', 17],
      ['ABBR', 5],
      ['DICT', 248],
    ])
  })

  it('checkAgs() lists each group with its line and row count', () => {
    expect(checkAgs(readAgs('gsq-site-investigation.ags'), testDictionary).groups).toEqual([
      { name: 'PROJ', line: 1, rows: 1 },
      { name: 'TRAN', line: 7, rows: 1 },
      { name: 'UNIT', line: 13, rows: 7 },
      { name: 'TYPE', line: 25, rows: 7 },
      { name: 'ABBR', line: 37, rows: 10 },
      { name: 'LOCA', line: 52, rows: 2 },
      { name: 'GEOL', line: 59, rows: 3 },
      { name: 'SAMP', line: 67, rows: 3 },
      { name: 'ISPT', line: 75, rows: 2 },
      { name: 'LNMC', line: 82, rows: 1 },
      { name: 'WSTG', line: 88, rows: 1 },
      { name: 'WSTD', line: 94, rows: 2 },
      { name: 'FILE', line: 101, rows: 1 },
    ])
  })

  it('checkAgs() an empty file: no PROJ, no TRAN, and no finding that throws', () => {
    expect(validateAgs('').map((i) => `${i.rule}@${i.line}`)).toEqual(['13@1', '14@1'])
  })
})

describe('writeAgsTables()', () => {
  it('writeAgsTables() quotes, doubles inner quotes, CR LF, maps non-ASCII', () => {
    const text = writeAgsTables([
      {
        name: 'PROJ',
        headings: headingsOf('PROJ', ['PROJ_ID', 'PROJ_NAME']),
        rows: [{ PROJ_ID: 'GSQ', PROJ_NAME: 'Say "hi" 70°' }],
      },
    ])
    expect(text).toBe(
      '"GROUP","PROJ"\r\n"HEADING","PROJ_ID","PROJ_NAME"\r\n"UNIT","",""\r\n"TYPE","ID","X"\r\n"DATA","GSQ","Say ""hi"" 70 deg"\r\n',
    )
  })
})
