import { describe, expect, it } from 'vitest'
import { validateAgs } from '../../backend/src/exports/ags4-validate'
import { headingsOf, writeAgsTables } from '../../backend/src/exports/ags4-format'

// A small hand-written AGS4 file following the published rules (AGS4 edition 4.1.1).
const lines = [
  '"GROUP","PROJ"',
  '"HEADING","PROJ_ID","PROJ_NAME"',
  '"UNIT","",""',
  '"TYPE","ID","X"',
  '"DATA","GSQ","Greyscar Quarry ""north wall"""',
  '',
  '"GROUP","TRAN"',
  '"HEADING","TRAN_ISNO","TRAN_DATE","TRAN_PROD","TRAN_STAT","TRAN_AGS","TRAN_DLIM","TRAN_RCON"',
  '"UNIT","","yyyy-mm-dd","","","","",""',
  '"TYPE","X","DT","X","X","X","X","X"',
  '"DATA","1","2026-12-01","Downdip","Draft","4.1.1","|","+"',
  '',
  '"GROUP","UNIT"',
  '"HEADING","UNIT_UNIT","UNIT_DESC"',
  '"UNIT","",""',
  '"TYPE","X","X"',
  '"DATA","m","metre"',
  '"DATA","deg","degree"',
  '"DATA","yyyy-mm-dd","date"',
  '',
  '"GROUP","TYPE"',
  '"HEADING","TYPE_TYPE","TYPE_DESC"',
  '"UNIT","",""',
  '"TYPE","X","X"',
  '"DATA","ID","Unique identifier"',
  '"DATA","X","Text"',
  '"DATA","DT","Date"',
  '"DATA","2DP","Value; 2 decimal places"',
  '"DATA","PA","Text listed in ABBR"',
  '',
  '"GROUP","ABBR"',
  '"HEADING","ABBR_HDNG","ABBR_CODE","ABBR_DESC"',
  '"UNIT","","",""',
  '"TYPE","X","X","X"',
  '"DATA","DISC_TYPE","Joint","Joint"',
  '"DATA","DISC_TYPE","Fault","Fault"',
  '',
  '"GROUP","LOCA"',
  '"HEADING","LOCA_ID","LOCA_NATE"',
  '"UNIT","","m"',
  '"TYPE","ID","2DP"',
  '"DATA","BH01","512000.00"',
  '',
  '"GROUP","DISC"',
  '"HEADING","LOCA_ID","DISC_TOP","DISC_BASE","FRAC_SET","DISC_NUMB","DISC_TYPE","DISC_DIP"',
  '"UNIT","","m","m","","","","deg"',
  '"TYPE","ID","2DP","2DP","X","X","PA","X"',
  '"DATA","BH01","10.40","10.40","J1","1","Joint","45.5"',
  '"DATA","BH01","12.00","12.00","J1","2","Fault","80"',
]
const good = lines.join('\r\n') + '\r\n'
const lineOf = (text: string, needle: string) =>
  text.split('\n').findIndex((l) => l.includes(needle)) + 1
const replace = (from: string, to: string) => good.replace(from, to)
const rules = (text: string) => validateAgs(text).map((i) => `${i.rule}@${i.line}`)

describe('validateAgs()', () => {
  it('validateAgs() hand-written valid file → no issues', () => {
    expect(validateAgs(good)).toEqual([])
  })
  it('validateAgs() missing UNIT row → row-order at the TYPE line', () => {
    const text = good.replace('"UNIT","","m","m","","","","deg"\r\n', '')
    expect(rules(text)).toContain(`row-order@${lineOf(text, '"TYPE","ID","2DP","2DP"')}`)
  })
  it('validateAgs() unquoted field → quoting', () => {
    const text = replace('"DATA","BH01","512000.00"', '"DATA",BH01,"512000.00"')
    expect(rules(text)).toContain(`quoting@${lineOf(text, 'BH01,')}`)
  })
  it('validateAgs() LF-only line ends → line-end on every line', () => {
    const text = good.replace(/\r\n/g, '\n')
    const issues = validateAgs(text).filter((i) => i.rule === 'line-end')
    expect(issues).toHaveLength(lines.length)
    expect(issues[0].line).toBe(1)
  })
  it('validateAgs() 10.4 given for a 2DP heading → value (10.40 passes)', () => {
    const text = replace('"BH01","10.40","10.40"', '"BH01","10.4","10.40"')
    expect(validateAgs(text)).toEqual([
      expect.objectContaining({ rule: 'value', line: lineOf(text, '"10.4",') }),
    ])
  })
  it('validateAgs() heading longer than 9 characters → heading-name', () => {
    const text = replace('"LOCA_ID","LOCA_NATE"', '"LOCA_ID","LOCA_NATEX"')
    expect(rules(text)).toContain(`heading-name@${lineOf(text, 'LOCA_NATEX')}`)
  })
  it('validateAgs() PA code not in ABBR → abbr', () => {
    const text = replace('"2","Fault"', '"2","Shear"')
    expect(rules(text)).toEqual([`abbr@${lineOf(text, '"Shear"')}`])
  })
  it('validateAgs() DISC row without a LOCA parent → parent', () => {
    const text = replace('"DATA","BH01","12.00"', '"DATA","BH09","12.00"')
    expect(rules(text)).toEqual([`parent@${lineOf(text, 'BH09')}`])
  })
  it('validateAgs() duplicate key combination → key', () => {
    const row = '"DATA","BH01","12.00","12.00","J1","2","Fault","80"'
    const text = good.replace(row, `${row}\r\n${row}`)
    expect(rules(text)).toEqual([`key@${lineOf(text, row) + 1}`])
  })
  it('validateAgs() empty REQUIRED field → required', () => {
    const text = replace('"1","2026-12-01","Downdip"', '"1","2026-12-01",""')
    expect(rules(text)).toEqual([`required@${lineOf(text, '"2026-12-01",""')}`])
  })
  it('validateAgs() no blank line between groups → blank-line', () => {
    const text = replace('"512000.00"\r\n\r\n', '"512000.00"\r\n')
    expect(rules(text)).toEqual([`blank-line@${lineOf(text, '"GROUP","DISC"')}`])
  })
  it('validateAgs() unit not listed in UNIT → unit', () => {
    const text = replace('"UNIT","","m"', '"UNIT","","ft"')
    expect(rules(text)).toEqual([`unit@${lineOf(text, '"UNIT","","ft"')}`])
  })
  it('validateAgs() type not listed in TYPE → type', () => {
    const text = replace('"DATA","PA","Text listed in ABBR"\r\n', '')
    expect(rules(text)).toEqual([`type@${lineOf(text, '"TYPE","ID","2DP","2DP","X","X","PA"')}`])
  })
  it('validateAgs() a field count unlike HEADING → field-count', () => {
    const text = replace('"DATA","BH01","512000.00"', '"DATA","BH01"')
    expect(rules(text)).toContain(`field-count@${lineOf(text, '"DATA","BH01"\r')}`)
  })
  it('validateAgs() two PROJ rows, unknown edition, bad date → single-row, edition, value', () => {
    const two = replace('north wall"""', 'north wall"""\r\n"DATA","GSQ2","Second"')
    expect(rules(two)).toEqual(['single-row@1'])
    const edition = replace('"4.1.1"', '"3.1"')
    expect(rules(edition)).toEqual([`edition@${lineOf(edition, '"GROUP","TRAN"')}`])
    const date = replace('"2026-12-01"', '"01/12/2026"')
    expect(rules(date)).toEqual([`value@${lineOf(date, '01/12/2026')}`])
  })
  it('validateAgs() non-ASCII character → ascii', () => {
    const text = replace('Greyscar Quarry', 'Greyscar Quärry')
    expect(rules(text)).toEqual([`ascii@${lineOf(text, 'Quärry')}`])
  })
  it('validateAgs() user-defined heading not declared in DICT → dict', () => {
    const text = good
      .replace('"DISC_DIP"', '"DISC_DIP","DISC_ALPH"')
      .replace(
        '"","deg"\r\n"TYPE","ID","2DP","2DP","X","X","PA","X"',
        '"","deg","deg"\r\n"TYPE","ID","2DP","2DP","X","X","PA","X","X"',
      )
      .replace('"45.5"', '"45.5","30"')
      .replace('"Fault","80"', '"Fault","80","60"')
    expect(rules(text)).toEqual([`dict@${lineOf(text, 'DISC_ALPH')}`])
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
