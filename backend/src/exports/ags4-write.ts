import {
  AGS_EDITION,
  typeDescriptions,
  unitDescriptions,
  userGroups,
  type AgsHeading,
} from './ags4-dictionary'
import { headingsOf, writeAgsTables, type AgsTable } from './ags4-format'
import {
  coreTable,
  discTable,
  discTypeCodes,
  fracTable,
  hornTable,
  locaTable,
  setTable,
} from './ags4-tables'
import { intervalTable } from './ags4-intervals'
import type { PackData } from './pack-types'
import { CAUTIONS } from './cautions'
import { DRAFT_MARK } from './sign-off'

/** Descriptions of the PA codes we write (ABBR_DESC). */
const abbrDescriptions: Record<string, Record<string, string>> = {
  LOCA_TYPE: { RC: 'Rotary cored borehole' },
  DICT_TYPE: { GROUP: 'Flag: a group definition', HEADING: 'Flag: a heading definition' },
  DICT_STAT: { KEY: 'Key field', REQUIRED: 'Required field', OTHER: 'Other field' },
  DISC_TYPE: Object.fromEntries(Object.values(discTypeCodes)),
}

/** TRAN_RECV when the pack names no recipient. */
export const RECIPIENT_NOT_STATED = 'Not stated'

export interface AgsMeta {
  packId: string
  generatedAt: Date
}

/**
 * The pack's AGS4 file: project, transmission, the meta groups (UNIT, TYPE, ABBR, DICT) listing
 * every unit, type, code and user-defined heading used, then LOCA, HORN, CORE, DISC, FRAC, DSET
 * and DINT (each interval's sign-off and settings). A draft pack says so in PROJ_MEMO and TRAN_STAT,
 * the free-text fields every reader shows first.
 */
export function writeAgs(data: PackData, meta: AgsMeta): string {
  const p = data.project
  const proj: AgsTable = {
    name: 'PROJ',
    headings: headingsOf('PROJ'),
    rows: [
      {
        PROJ_ID: p.code,
        PROJ_NAME: p.name,
        PROJ_MEMO: [
          ...(data.draft ? [`${DRAFT_MARK}: intervals in this file are not all approved.`] : []),
          ...CAUTIONS,
          'Each interval is analysed with its own saved settings and signed off as listed in DINT.',
        ].join(' '),
      },
    ],
  }
  const tran: AgsTable = {
    name: 'TRAN',
    headings: headingsOf('TRAN'),
    rows: [
      {
        TRAN_ISNO: meta.packId.slice(0, 8),
        TRAN_DATE: meta.generatedAt.toISOString().slice(0, 10),
        TRAN_PROD: 'Downdip',
        TRAN_STAT: data.draft ? DRAFT_MARK : 'Design pack',
        TRAN_DESC: 'Downdip design pack: discontinuities, set statistics and interval sign-off',
        TRAN_AGS: AGS_EDITION,
        // REQUIRED (Rule 10b). Downdip records no client or addressee for a project, and a name
        // guessed here would be a false statement in the file: the gap is said outright instead.
        TRAN_RECV: RECIPIENT_NOT_STATED,
        TRAN_DLIM: '|',
      },
    ],
  }
  // Rule 2: a group holds at least one DATA row, so a group with nothing to say is left out (an
  // interval without runs writes no CORE, one without sets no DSET).
  const withRows = (tables: AgsTable[]) => tables.filter((t) => t.rows.length > 0)
  const body = withRows([
    locaTable(data),
    hornTable(data),
    coreTable(data),
    discTable(data),
    fracTable(data),
  ])
  const sets = withRows([setTable(data), intervalTable(data)])
  const dict = dictTable([...body, ...sets])
  const described = [proj, tran, dict, ...body, ...sets]
  const abbr = abbrTable(described)
  const unitsAndTypes = [...described, abbr]
  // Rule 15: every unit of a UNIT row and every PU value; Rule 17: every type and PT value.
  const unit: AgsTable = {
    name: 'UNIT',
    headings: headingsOf('UNIT'),
    rows: listed(unitsAndTypes, (h) => h.unit, 'PU').map((x) => ({
      UNIT_UNIT: x,
      UNIT_DESC: unitDescriptions[x] ?? x,
    })),
  }
  const typeTable: AgsTable = {
    name: 'TYPE',
    headings: headingsOf('TYPE'),
    rows: listed([...unitsAndTypes, unit], (h) => h.type, 'PT').map((x) => ({
      TYPE_TYPE: x,
      TYPE_DESC: typeDescriptions[x] ?? x,
    })),
  }
  return writeAgsTables([proj, tran, ...withRows([unit, typeTable, abbr, dict]), ...body, ...sets])
}

/** DICT: our user-defined groups and every user-defined heading, with status, type and unit. */
function dictTable(tables: AgsTable[]): AgsTable {
  const rows: Record<string, string>[] = []
  for (const t of tables) {
    // A GROUP row has no status, type or unit; its parent is REQUIRED (dictionary note on DICT).
    if (userGroups[t.name])
      rows.push({
        DICT_TYPE: 'GROUP',
        DICT_GRP: t.name,
        DICT_DESC: userGroups[t.name].description,
        DICT_PGRP: userGroups[t.name].parent,
      })
    for (const h of t.headings.filter((x) => x.user))
      rows.push({
        DICT_TYPE: 'HEADING',
        DICT_GRP: t.name,
        DICT_HDNG: h.name,
        DICT_STAT: h.status,
        DICT_DTYP: h.type,
        DICT_DESC: h.description,
        DICT_UNIT: h.unit,
      })
  }
  return { name: 'DICT', headings: headingsOf('DICT'), rows }
}

/** The distinct non-empty values of a heading property, and of every DATA value of `dataType`. */
function listed(tables: AgsTable[], of: (h: AgsHeading) => string, dataType: string): string[] {
  const values = tables.flatMap((t) => [
    ...t.headings.map(of),
    ...t.headings.filter((h) => h.type === dataType).flatMap((h) => t.rows.map((r) => r[h.name])),
  ])
  return [...new Set(values)].filter((x) => x !== undefined && x !== '').sort()
}

/** ABBR: every PA code the other groups use, with its description. */
function abbrTable(tables: AgsTable[]): AgsTable {
  const seen = new Set<string>()
  const rows: Record<string, string>[] = []
  for (const t of tables)
    for (const h of t.headings.filter((x) => x.type === 'PA'))
      for (const r of t.rows) {
        const code = r[h.name]
        if (!code || seen.has(`${h.name}|${code}`)) continue
        seen.add(`${h.name}|${code}`)
        rows.push({
          ABBR_HDNG: h.name,
          ABBR_CODE: code,
          ABBR_DESC: abbrDescriptions[h.name]?.[code] ?? describeCode(h.name, code),
        })
      }
  return { name: 'ABBR', headings: headingsOf('ABBR'), rows }
}

/** Codes with no fixed description: the coordinate reference system of LOCA_GREF. */
function describeCode(heading: string, code: string): string {
  const epsg = /^EPSG:(\d+)$/.exec(code)
  if (heading === 'LOCA_GREF' && epsg) return `EPSG ${epsg[1]} coordinate reference system`
  return code
}
