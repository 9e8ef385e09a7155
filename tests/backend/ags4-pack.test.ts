import { describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { projects, structures } from '../../schema/index'
import { loadPackData } from '../../backend/src/services/pack-data'
import { writeAgs } from '../../backend/src/exports/ags4-write'
import { checkAgs } from '../../backend/src/exports/ags4-validate'
import { parseAgs } from '../../backend/src/exports/ags4-parse'
import { packSuite } from './pack-setup'
import { agsGroup } from './pack-text'
import { testDictionary } from './ags4-files'

// The pack's AGS4 file against Rules 1-20 with the built-in groups alone (as the pack build
// checks it) and with the AGS 4.1.1 standard dictionary loaded (our test subset of it, which
// holds every KEY and REQUIRED heading of the groups we write). The fixture: two approved
// intervals of TST-01 (pack-setup.ts).
const standardGroups = () => testDictionary.groups
const { ctx } = packSuite()

async function packAgs(): Promise<string> {
  const [project] = await ctx.fx.db.select().from(projects).where(eq(projects.id, ctx.fx.projectId))
  const data = await loadPackData(ctx.fx.db, project, {})
  return writeAgs(data, {
    packId: '0a1b2c3d-0000-4000-8000-000000000000',
    generatedAt: new Date('2026-12-01T10:00:00Z'),
  })
}

describe('writeAgs() against the 4.1.1 dictionary', () => {
  it('writeAgs() passes every rule check with the built-in groups alone: no error, no warning, nothing unchecked', async () => {
    const check = checkAgs(await packAgs())
    expect(check).toMatchObject({
      issues: [],
      unchecked: [],
      dictionary: { edition: '4.1.1', source: 'built-in' },
    })
  })

  it('writeAgs() leaves out a group with no rows (Rule 2): a pack of bare intervals still passes', async () => {
    const [project] = await ctx.fx.db
      .select()
      .from(projects)
      .where(eq(projects.id, ctx.fx.projectId))
    const data = await loadPackData(ctx.fx.db, project, {})
    const bare = {
      ...data,
      stations: [],
      runs: new Map(),
      structures: [],
      assignment: new Map(),
      intervals: data.intervals.map((i) => ({
        ...i,
        analysis: { ...i.analysis, sets: [], intersections: [] },
      })),
    }
    const text = writeAgs(bare, {
      packId: '0a1b2c3d-0000-4000-8000-000000000000',
      generatedAt: new Date('2026-12-01T10:00:00Z'),
    })
    const groups = parseAgs(text).groups.map((g) => g.name)
    expect(groups).not.toContain('CORE')
    expect(groups).not.toContain('DISC')
    expect(groups).toContain('DINT')
    expect(checkAgs(text).issues).toEqual([])
    // no interval at all: no user-defined group, so no DICT either
    const none = writeAgs(
      { ...bare, intervals: [] },
      {
        packId: '0a1b2c3d-0000-4000-8000-000000000000',
        generatedAt: new Date('2026-12-01T10:00:00Z'),
      },
    )
    expect(parseAgs(none).groups.map((g) => g.name)).not.toContain('DICT')
    expect(checkAgs(none).issues).toEqual([])
  })

  it('writeAgs() passes every rule check with the 4.1.1 dictionary loaded', async () => {
    const check = checkAgs(await packAgs(), testDictionary)
    expect(check).toMatchObject({ issues: [], unchecked: [], dictionary: { source: 'loaded' } })
  })

  it('writeAgs() standard headings: dictionary order, type and unit exactly; every KEY and REQUIRED heading', async () => {
    const { groups } = parseAgs(await packAgs())
    const declared = new Set(
      agsGroup(await packAgs(), 'DICT').map((r) => `${r.DICT_GRP}.${r.DICT_HDNG}`),
    )
    for (const g of groups) {
      const std = standardGroups().get(g.name)
      if (!std) continue
      const order = std.headings.map((h) => h.name)
      const standard = g.headings.filter((h) => order.includes(h))
      expect(standard, `${g.name} in dictionary order`).toEqual(
        order.filter((h) => standard.includes(h)),
      )
      // user-defined headings only after the standard ones, and each declared in DICT
      const user = g.headings.slice(standard.length)
      expect(g.headings.slice(0, standard.length)).toEqual(standard)
      for (const h of user)
        expect(declared.has(`${g.name}.${h}`), `${g.name}.${h} in DICT`).toBe(true)
      for (const h of std.headings) {
        const i = g.headings.indexOf(h.name)
        if (h.status !== 'OTHER')
          expect(i, `${g.name}.${h.name} (${h.status}) written`).toBeGreaterThanOrEqual(0)
        if (i >= 0)
          expect([g.types[i], g.units[i]], `${g.name}.${h.name}`).toEqual([h.type, h.unit])
      }
    }
  })

  it('writeAgs() LOCA in the 4.1.1 order (LOCA_GREF, LOCA_GL, LOCA_FDEP), LOCA_GREF a PA code in ABBR', async () => {
    const ags = await packAgs()
    expect(ags).toContain(
      '"HEADING","LOCA_ID","LOCA_TYPE","LOCA_NATE","LOCA_NATN","LOCA_GREF","LOCA_GL","LOCA_FDEP"\r\n',
    )
    expect(agsGroup(ags, 'ABBR')).toContainEqual({
      ABBR_HDNG: 'LOCA_GREF',
      ABBR_CODE: 'EPSG:32630',
      ABBR_DESC: 'EPSG 32630 coordinate reference system',
    })
  })

  it('writeAgs() TRAN: TRAN_RECV "Not stated" (REQUIRED; Downdip records no recipient), 4.1.1, "|"', async () => {
    expect(agsGroup(await packAgs(), 'TRAN')).toEqual([
      {
        TRAN_ISNO: '0a1b2c3d',
        TRAN_DATE: '2026-12-01',
        TRAN_PROD: 'Downdip',
        TRAN_STAT: 'Design pack',
        TRAN_DESC: 'Downdip design pack: discontinuities, set statistics and interval sign-off',
        TRAN_AGS: '4.1.1',
        TRAN_RECV: 'Not stated',
        TRAN_DLIM: '|',
      },
    ])
  })

  it('writeAgs() DICT declares only our own headings and groups, and all of them', async () => {
    const dict = agsGroup(await packAgs(), 'DICT')
    expect(
      dict
        .filter((r) => r.DICT_TYPE === 'GROUP')
        .map((r) => [r.DICT_GRP, r.DICT_PGRP, r.DICT_STAT]),
    ).toEqual([
      ['DSET', 'LOCA', ''],
      ['DINT', 'LOCA', ''],
    ])
    const standardDeclared = dict.filter(
      (r) =>
        r.DICT_TYPE === 'HEADING' &&
        standardGroups()
          .get(r.DICT_GRP)
          ?.headings.some((h) => h.name === r.DICT_HDNG),
    )
    expect(standardDeclared).toEqual([])
    expect(dict.filter((r) => r.DICT_GRP === 'DISC').map((r) => r.DICT_HDNG)).toEqual([
      'DISC_ALPH',
      'DISC_BETA',
      'DISC_REFL',
      'DISC_OCNF',
      'DISC_SRC',
      'DISC_INTV',
      'DISC_TWGT',
      'DISC_FLAG',
      'DISC_U95',
      'DISC_UWHY',
      'DISC_ROTN',
      'DISC_DSHF',
      'DISC_PRCL',
    ])
    // the set means' two cones beside Fisher's alpha95, declared as our own headings
    const dset = dict.filter((r) => r.DICT_GRP === 'DSET').map((r) => r.DICT_HDNG)
    expect(dset.slice(dset.indexOf('DSET_A95'), dset.indexOf('DSET_A95') + 3)).toEqual([
      'DSET_A95',
      'DSET_SY95',
      'DSET_U95',
    ])
  })

  it('writeAgs() DISC_JRC as 0DP and the ISRM persistence class in DISC_PRCL, not in DISC_PERS (1DP, m)', async () => {
    await ctx.fx.db
      .update(structures)
      .set({ jrc: 12.4, persistence: 'low' })
      .where(eq(structures.holeId, ctx.fx.holeId))
    const ags = await packAgs()
    const disc = agsGroup(ags, 'DISC')
    expect(new Set(disc.map((r) => [r.DISC_JRC, r.DISC_PRCL, r.DISC_PERS].join('|')))).toEqual(
      new Set(['12|low|']),
    )
    expect(checkAgs(ags).issues).toEqual([])
    expect(checkAgs(ags, testDictionary).issues).toEqual([])
  })
})
