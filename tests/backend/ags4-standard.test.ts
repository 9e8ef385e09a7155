import { describe, expect, it } from 'vitest'
import {
  builtInDictionary,
  isKey,
  isRequired,
  standardHeading,
} from '../../backend/src/exports/ags4-standard'
import { agsGroups, userGroups } from '../../backend/src/exports/ags4-dictionary'
import { testDictionary } from './ags4-files'

// Spot values of the AGS 4.1.1 standard data dictionary (AGS, the DICT group of its 4.1.1
// dictionary file) for the groups Downdip writes: the definitions Downdip builds in, and the
// same definitions in our test subset of that dictionary (testdata/ags4/dictionary).
const status = (g: string, h: string) => standardHeading(builtInDictionary(), g, h)?.status

describe('builtInDictionary() the groups Downdip writes, as AGS 4.1.1 defines them', () => {
  it('builtInDictionary() holds exactly the standard groups the writer emits, and no other', () => {
    const built = builtInDictionary()
    expect(built).toMatchObject({ edition: '4.1.1', source: 'built-in' })
    const written = Object.keys(agsGroups).filter((g) => !userGroups[g])
    expect([...built.groups.keys()]).toEqual(written)
    expect(written).toEqual([
      'PROJ',
      'TRAN',
      'UNIT',
      'TYPE',
      'ABBR',
      'DICT',
      'LOCA',
      'HORN',
      'CORE',
      'DISC',
      'FRAC',
    ])
    expect(
      ['LOCA', 'HORN', 'CORE', 'DISC', 'FRAC'].map((g) => built.groups.get(g)?.parent),
    ).toEqual(['PROJ', 'LOCA', 'LOCA', 'LOCA', 'LOCA'])
    expect([...built.groups.values()].reduce((n, g) => n + g.headings.length, 0)).toBe(68)
  })

  it('standardHeading() TRAN and the meta groups: statuses of 4.1.1', () => {
    expect(status('TRAN', 'TRAN_RECV')).toBe('REQUIRED')
    expect([status('TRAN', 'TRAN_DLIM'), status('TRAN', 'TRAN_RCON')]).toEqual(['OTHER', 'OTHER'])
    expect(
      ['UNIT_DESC', 'TYPE_DESC', 'ABBR_DESC', 'DICT_DESC'].map((h) => status(h.slice(0, 4), h)),
    ).toEqual(Array(4).fill('REQUIRED'))
    expect(
      [
        'PROJ_ID',
        'TRAN_ISNO',
        'UNIT_UNIT',
        'TYPE_TYPE',
        'ABBR_HDNG',
        'ABBR_CODE',
        'DICT_TYPE',
        'DICT_GRP',
      ].map((h) => status(h.slice(0, 4), h)),
    ).toEqual(Array(8).fill('KEY+REQUIRED'))
    expect(status('DICT', 'DICT_HDNG')).toBe('KEY')
    const built = builtInDictionary()
    expect([
      standardHeading(built, 'DICT', 'DICT_DTYP')?.type,
      standardHeading(built, 'DICT', 'DICT_UNIT')?.type,
    ]).toEqual(['PT', 'PU'])
  })

  it('standardHeading() LOCA, CORE, DISC, FRAC: the order, types and units the pack writes by', () => {
    const built = builtInDictionary()
    expect(built.groups.get('LOCA')!.headings.map((h) => h.name)).toEqual([
      'LOCA_ID',
      'LOCA_TYPE',
      'LOCA_NATE',
      'LOCA_NATN',
      'LOCA_GREF',
      'LOCA_GL',
      'LOCA_FDEP',
    ])
    expect(standardHeading(built, 'LOCA', 'LOCA_GREF')).toEqual({
      name: 'LOCA_GREF',
      status: 'OTHER',
      type: 'PA',
      unit: '',
    })
    expect(status('CORE', 'CORE_BASE')).toBe('KEY')
    const disc = (h: string) => standardHeading(built, 'DISC', h)
    expect([disc('DISC_JRC'), disc('DISC_APT')].map((d) => [d?.type, d?.unit])).toEqual([
      ['0DP', ''],
      ['XN', 'mm'],
    ])
    expect([disc('DISC_DIP'), disc('FRAC_SET')].map((d) => [d?.type, d?.unit, d?.status])).toEqual([
      ['X', 'deg', 'OTHER'],
      ['X', '', 'KEY'],
    ])
    const frac = ['FRAC_IMAX', 'FRAC_IAVE', 'FRAC_IMIN', 'FRAC_FI'].map((h) =>
      standardHeading(built, 'FRAC', h),
    )
    expect(frac.map((f) => [f?.type, f?.unit])).toEqual([
      ['XN', 'mm'],
      ['XN', 'mm'],
      ['XN', 'mm'],
      ['XN', ''],
    ])
  })

  it('builtInDictionary() agrees with the loaded test dictionary, and holds every KEY and REQUIRED heading of its groups', () => {
    for (const g of builtInDictionary().groups.values()) {
      const loaded = testDictionary.groups.get(g.name)!
      expect(loaded.parent, g.name).toBe(g.parent)
      // same definitions, in the loaded order
      const names = g.headings.map((h) => h.name)
      expect(
        loaded.headings.filter((h) => names.includes(h.name)),
        g.name,
      ).toEqual(g.headings)
      const keyOrRequired = loaded.headings.filter((h) => isKey(h.status) || isRequired(h.status))
      for (const h of keyOrRequired) expect(names, `${g.name}.${h.name}`).toContain(h.name)
    }
  })
})
