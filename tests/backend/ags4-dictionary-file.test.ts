import { describe, expect, it } from 'vitest'
import {
  DictionaryFileError,
  readDictionaryFile,
  type DictionaryFileProblem,
} from '../../backend/src/exports/ags4-dictionary-file'
import { dictionaryText, dropColumn, edit, lab, lineOf, monitoring, site } from './ags4-files'

// readDictionaryFile(): an edition's standard dictionary in the AGS4 dictionary format (groups
// PROJ, TRAN, TYPE, UNIT, ABBR, DICT; DICT rows of DICT_TYPE GROUP and HEADING). Values are those
// of our own test subset (testdata/ags4/dictionary), which follows AGS 4.1.1.
function problems(text: string): DictionaryFileProblem[] {
  try {
    readDictionaryFile(text)
  } catch (err: unknown) {
    if (err instanceof DictionaryFileError) return err.problems
    throw err
  }
  throw new Error('the file was read as a dictionary')
}

describe('readDictionaryFile()', () => {
  it('readDictionaryFile() the test subset: its edition, 28 groups and 220 headings in order', () => {
    const file = readDictionaryFile(dictionaryText)
    expect(file.edition).toEqual({ value: '4.1.1', line: 11 })
    expect([file.groups.length, file.headingCount]).toEqual([28, 220])
    expect(file.groups.slice(0, 8).map((g) => g.name)).toEqual([
      'PROJ',
      'ABBR',
      'DICT',
      'FILE',
      'TRAN',
      'TYPE',
      'UNIT',
      'CORE',
    ])
    const grat = file.groups.find((g) => g.name === 'GRAT')!
    expect([grat.parent, grat.title, grat.headings.length]).toEqual([
      'GRAG',
      'Group GRAT (test subset)',
      10,
    ])
    expect(grat.headings[7]).toEqual({ name: 'GRAT_SIZE', status: 'KEY', type: '3SF', unit: 'mm' })
    // a unit with colons is kept whole (DT in yyyy-mm-ddThh:mm:ss)
    expect(file.groups.find((g) => g.name === 'MOND')!.headings[3]).toEqual({
      name: 'MOND_DTIM',
      status: 'KEY',
      type: 'DT',
      unit: 'yyyy-mm-ddThh:mm:ss',
    })
    expect(file.groups.find((g) => g.name === 'PROJ')!.headings[0].status).toBe('KEY+REQUIRED')
  })

  it('readDictionaryFile() refuses a data file: no DICT group; a DICT of user groups whose parent or group it lacks', () => {
    expect(problems(site)).toEqual([
      { message: 'the file has no DICT group: it is not an AGS4 standard dictionary' },
    ])
    expect(problems(lab)).toEqual([
      {
        line: lineOf(lab, '"DATA","GROUP","GSQC"'),
        field: 'DICT_PGRP',
        message: 'the parent group SAMP of GSQC is not defined in the file',
      },
    ])
    expect(problems(monitoring)[0]).toEqual({
      line: lineOf(monitoring, '"MOND_BATT","OTHER"'),
      field: 'DICT_GRP',
      message: 'no GROUP row defines group MOND',
    })
  })

  it('readDictionaryFile() names the line and heading of a bad type, status or DICT_TYPE', () => {
    const type = edit(dictionaryText, '"GRAT_SIZE","KEY","3SF"', '"GRAT_SIZE","KEY","3XF"')
    expect(problems(type)).toEqual([
      {
        line: lineOf(type, '"3XF"'),
        field: 'DICT_DTYP',
        message: 'DICT_DTYP "3XF": not an AGS4 data type',
      },
    ])
    const status = edit(dictionaryText, '"GRAT_SIZE","KEY"', '"GRAT_SIZE","MAYBE"')
    expect(problems(status)).toEqual([
      {
        line: lineOf(status, '"MAYBE"'),
        field: 'DICT_STAT',
        message: 'DICT_STAT "MAYBE": KEY, REQUIRED, KEY+REQUIRED or OTHER',
      },
    ])
    const kind = edit(
      dictionaryText,
      '"DATA","HEADING","GRAT","GRAT_SIZE"',
      '"DATA","NOTE","GRAT","GRAT_SIZE"',
    )
    expect(problems(kind)).toEqual([
      {
        line: lineOf(kind, '"NOTE"'),
        field: 'DICT_TYPE',
        message: 'DICT_TYPE "NOTE": GROUP or HEADING',
      },
    ])
  })

  it('readDictionaryFile() reads statuses as written in either order and case; an empty one is OTHER', () => {
    const text = edit(
      edit(dictionaryText, '"GRAT_SIZE","KEY"', '"GRAT_SIZE","required+key"'),
      '"GRAT_PERP","OTHER"',
      '"GRAT_PERP",""',
    )
    const grat = readDictionaryFile(text).groups.find((g) => g.name === 'GRAT')!
    expect(grat.headings.slice(7, 9).map((h) => h.status)).toEqual(['KEY+REQUIRED', 'OTHER'])
  })

  it('readDictionaryFile() refuses a heading twice, a group twice, a group without headings', () => {
    const row = '"DATA","HEADING","GRAT","GRAT_PERP","OTHER","0DP","Test subset definition","%",""'
    const twice = edit(dictionaryText, row, `${row}\r\n${row}`)
    expect(problems(twice)).toEqual([
      {
        line: lineOf(twice, row) + 1,
        field: 'DICT_HDNG',
        message: 'GRAT_PERP is listed twice in GRAT',
      },
    ])
    const group = '"DATA","GROUP","GRAT","","","","Group GRAT (test subset)","","GRAG"'
    const again = edit(dictionaryText, group, `${group}\r\n${group}`)
    expect(problems(again)[0]).toEqual({
      line: lineOf(again, group) + 1,
      field: 'DICT_GRP',
      message: `group GRAT is defined twice (first at line ${lineOf(again, group)})`,
    })
    const bare = edit(
      dictionaryText,
      group,
      `${group}\r\n"DATA","GROUP","GSQX","","","","Empty","","LOCA"`,
    )
    expect(problems(bare)).toEqual([
      {
        line: lineOf(bare, '"GSQX"'),
        field: 'DICT_GRP',
        message: 'group GSQX has no HEADING rows',
      },
    ])
  })

  it('readDictionaryFile() refuses a DICT without a needed heading, or with a row it cannot split', () => {
    const noType = dropColumn(dictionaryText, 'DICT', 'DICT_DTYP')
    expect(problems(noType)).toEqual([
      {
        line: lineOf(noType, '"HEADING","DICT_TYPE"'),
        field: 'DICT_DTYP',
        message: 'DICT has no DICT_DTYP heading',
      },
    ])
    const short = edit(
      dictionaryText,
      '"GRAT_PERP","OTHER","0DP","Test subset definition","%",""',
      '"GRAT_PERP","OTHER","0DP"',
    )
    expect(problems(short)).toEqual([
      {
        line: lineOf(short, '"GRAT_PERP","OTHER","0DP"\r'),
        message: 'Rule 4: 6 fields where the HEADING row has 9',
      },
    ])
  })

  it('readDictionaryFile() refuses a DICT with no GROUP or HEADING rows', () => {
    const lines = dictionaryText.split('\r\n')
    const dict = lines.indexOf('"GROUP","DICT"')
    const empty = [...lines.slice(0, dict + 4), ''].join('\r\n')
    expect(problems(empty)).toEqual([
      {
        line: dict + 1,
        field: 'DICT_TYPE',
        message: 'DICT has no GROUP or HEADING rows: the file is not an AGS4 standard dictionary',
      },
    ])
  })
})
