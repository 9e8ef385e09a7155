import { describe, expect, it } from 'vitest'
import { checkAgs } from '../../backend/src/exports/ags4-validate'
import {
  dropColumn,
  edit,
  findings,
  lab,
  lineOf,
  messages,
  monitoring,
  site,
  testDictionary,
} from './ags4-files'

// Rules 8, 10a, 10b, 12, 15, 16 and 17, each broken once in a valid file of our own. Statuses
// and types are those of the AGS 4.1.1 standard dictionary (our test subset of it loaded,
// testdata/ags4/dictionary); rule texts from memory.
describe('checkAgs() values: Rule 8', () => {
  it('checkAgs() Rule 8: 2DP given one decimal; 3SF given two figures; 1SCI written out', () => {
    const dp = edit(site, '"1420.50"', '"1420.5"')
    expect(findings(dp)).toEqual([`8@${lineOf(dp, '"1420.5"')}`])
    expect(messages(dp)).toEqual([
      'Rule 8: LOCA_NATE: "1420.5" is not a number with 2 decimal places',
    ])
    const sf = edit(lab, '"1.50","20.0","88"', '"1.50","20","88"')
    expect(findings(sf)).toEqual([`8@${lineOf(sf, '"20","88"')}`])
    const sci = edit(monitoring, '"3.2E-6"', '"0.0000032"')
    expect(findings(sci)).toEqual([`8@${lineOf(sci, '0.0000032')}`])
  })

  it('checkAgs() Rule 8: a DT off its UNIT pattern, a month 13, and an elapsed time h:mm', () => {
    const space = edit(site, '"2026-11-03T09:40"', '"2026-11-03 09:40"')
    expect(findings(space)).toEqual([`8@${lineOf(space, '2026-11-03 09:40')}`])
    const month = edit(site, '"2026-11-03T09:40"', '"2026-13-03T09:40"')
    expect(messages(month)).toEqual([
      'Rule 8: SAMP_DTIM: "2026-13-03T09:40" is not a valid date and time in "yyyy-mm-ddThh:mm"',
    ])
    const elapsed = edit(monitoring, '"00:45"', '"0:45"')
    expect(findings(elapsed)).toEqual([`8@${lineOf(elapsed, '"0:45"')}`])
  })

  it('checkAgs() Rule 8: an ID twice in the group it identifies (SAMP_ID in SAMP)', () => {
    const text = edit(site, '"C","GSQ05-002"', '"C","GSQ05-001"')
    expect(findings(text)).toEqual([`8@${lineOf(text, '"C","GSQ05-001"')}`])
    expect(messages(text)[0]).toBe(
      `Rule 8: SAMP_ID "GSQ05-001" is not unique (also line ${lineOf(site, '"B","GSQ05-001"')})`,
    )
  })

  it('checkAgs() Rule 8: a type that is no AGS4 type; a type unlike the dictionary (warning)', () => {
    const unknown = edit(
      site,
      '"TYPE","ID","2DP","X","PA","ID","2DP","DT","X"',
      '"TYPE","ID","2DP","X","PA","ID","2DP","DATE","X"',
    )
    expect(findings(unknown)).toEqual([`8@${lineOf(unknown, '"DATE"')}`])
    const gref = edit(site, '"TYPE","ID","PA","2DP","2DP","PA"', '"TYPE","ID","PA","2DP","2DP","X"')
    expect(findings(gref)).toEqual([])
    expect(checkAgs(gref, testDictionary).issues).toEqual([
      {
        line: lineOf(gref, '"TYPE","ID","PA","2DP","2DP","X"'),
        rule: '8',
        severity: 'warning',
        message: 'Rule 8: LOCA_GREF is written as X; the dictionary defines it as PA',
      },
    ])
  })
})

describe('checkAgs() KEY and REQUIRED: Rules 10a, 10b, 12', () => {
  it('checkAgs() Rule 10a: a KEY heading left out; the same KEY fields twice', () => {
    const noKey = dropColumn(site, 'SAMP', 'SAMP_REF')
    expect(findings(noKey)).toEqual([
      `10a@${lineOf(noKey, '"HEADING","LOCA_ID","SAMP_TOP","SAMP_TYPE"')}`,
    ])
    const row = '"DATA","GSQ-BH05","4.10","20","3.60"'
    const twice = edit(site, row, `${row}\r\n${row}`)
    expect(findings(twice)).toEqual([`10a@${lineOf(twice, row) + 1}`])
    expect(messages(twice)[0]).toBe(
      `Rule 10a: the KEY fields repeat those of line ${lineOf(twice, row)} (LOCA_ID, WSTG_DPTH, WSTD_NMIN)`,
    )
  })

  it('checkAgs() Rule 10b: TRAN_RECV (REQUIRED in 4.1.1) empty, then left out', () => {
    const empty = edit(site, '"4.1.1","Greyscar Aggregates"', '"4.1.1",""')
    expect(findings(empty)).toEqual([`10b@${lineOf(empty, '"4.1.1",""')}`])
    expect(messages(empty)).toEqual(['Rule 10b: REQUIRED field TRAN_RECV is empty'])
    const gone = dropColumn(site, 'TRAN', 'TRAN_RECV')
    expect(findings(gone)).toEqual([`10b@${lineOf(gone, '"HEADING","TRAN_ISNO"')}`])
  })

  it('checkAgs() Rule 10b: a KEY+REQUIRED field (ABBR_CODE) empty', () => {
    const text = edit(site, '"ISPT_TYPE","S"', '"ISPT_TYPE",""')
    expect(findings(text)).toContain(`10b@${lineOf(text, '"ISPT_TYPE",""')}`)
  })

  it('checkAgs() Rule 12: empty OTHER fields pass; a field of spaces is a warning', () => {
    expect(findings(edit(site, '"Dry","S"', '"","S"'))).toEqual([])
    const spaces = edit(site, '"Slow inflow at the clay over limestone contact"', '"   "')
    expect(findings(spaces)).toEqual([])
    expect(findings(spaces, true)).toEqual([`12@${lineOf(spaces, '"   "')}`])
  })
})

describe('checkAgs() lists of the file: Rules 15, 16, 17', () => {
  it('checkAgs() Rule 15: a unit of a UNIT row not in UNIT; a PU value not in UNIT', () => {
    const unit = edit(site, '"DATA","DegC","degree Celsius"\r\n', '')
    expect(findings(unit)).toEqual([
      `15@${lineOf(unit, '"UNIT","","m","","","","","m","%","DegC"')}`,
    ])
    const pu = edit(monitoring, '"4.8","mm/s"', '"4.8","in/s"')
    expect(findings(pu)).toEqual([`15@${lineOf(pu, '"in/s"')}`])
  })

  it('checkAgs() Rule 16: a code not in ABBR; a concatenated code split at TRAN_RCON', () => {
    const code = edit(site, '"Dry","S"', '"Dry","SS"')
    expect(findings(code)).toEqual([`16@${lineOf(code, '"SS"')}`])
    const joined = edit(site, '"CP+RC"', '"CP+WS"')
    expect(messages(joined)).toEqual([
      'Rule 16: LOCA_TYPE: "WS" is not listed in ABBR (codes of "CP+WS" split at "+")',
    ])
    // "CP+RC" passes only because CP and RC are each listed.
    expect(findings(site)).toEqual([])
  })

  it('checkAgs() Rule 16a: TRAN_RCON of two characters', () => {
    const text = edit(site, '"|","+"', '"|","++"')
    expect(findings(text)).toEqual([`16a@${lineOf(text, '"++"')}`, `16@${lineOf(text, '"CP+RC"')}`])
  })

  it('checkAgs() Rule 17: a type of a TYPE row not in TYPE; a PT value not in TYPE', () => {
    const type = edit(site, '"DATA","XN","Text or numeric"\r\n', '')
    expect(findings(type)).toEqual([`17@${lineOf(type, '"TYPE","ID","2DP","0DP","0DP","0DP"')}`])
    const pt = edit(monitoring, '"DATA","1DP","Value; 1 decimal place"\r\n', '')
    expect(findings(pt)).toEqual([
      `17@${lineOf(pt, '"MOND_BATT","OTHER","1DP"')}`,
      `17@${lineOf(pt, '"TYPE","ID","X","2DP","DT","PA","X","XN","PU","U","1DP"')}`,
    ])
  })
})
