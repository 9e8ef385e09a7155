import type { AgsStatus, StandardGroup, StandardHeading } from './ags4-standard'

/** The edition whose definitions this table follows, and so the edition Downdip writes. */
export const GROUPS_WE_WRITE_EDITION = '4.1.1'

const h = (name: string, status: AgsStatus, type: string, unit = ''): StandardHeading => ({
  name,
  status,
  type,
  unit,
})
const KR = 'KEY+REQUIRED'

/**
 * The standard groups Downdip writes and, of each, only the headings it writes (plus TRAN_RCON,
 * which its validator reads: Rule 16a), in the order, status, data type and unit of the AGS 4.1.1
 * standard data dictionary. The dictionary itself is © AGS and is not shipped: a full edition is
 * loaded by an administrator (POST /api/ags/dictionaries). Every KEY and REQUIRED heading of these
 * groups is here, because the pack writes them all (tests/backend/ags4-pack.test.ts proves it
 * against a loaded dictionary).
 */
export const groupsWeWrite: readonly StandardGroup[] = [
  {
    name: 'PROJ',
    parent: undefined,
    headings: [h('PROJ_ID', KR, 'ID'), h('PROJ_NAME', 'OTHER', 'X'), h('PROJ_MEMO', 'OTHER', 'X')],
  },
  {
    name: 'TRAN',
    parent: undefined,
    headings: [
      h('TRAN_ISNO', KR, 'X'),
      h('TRAN_DATE', 'REQUIRED', 'DT', 'yyyy-mm-dd'),
      h('TRAN_PROD', 'REQUIRED', 'X'),
      h('TRAN_STAT', 'REQUIRED', 'X'),
      h('TRAN_DESC', 'OTHER', 'X'),
      h('TRAN_AGS', 'REQUIRED', 'X'),
      h('TRAN_RECV', 'REQUIRED', 'X'),
      h('TRAN_DLIM', 'OTHER', 'X'),
      h('TRAN_RCON', 'OTHER', 'X'),
    ],
  },
  {
    name: 'UNIT',
    parent: undefined,
    headings: [h('UNIT_UNIT', KR, 'X'), h('UNIT_DESC', 'REQUIRED', 'X')],
  },
  {
    name: 'TYPE',
    parent: undefined,
    headings: [h('TYPE_TYPE', KR, 'X'), h('TYPE_DESC', 'REQUIRED', 'X')],
  },
  {
    name: 'ABBR',
    parent: undefined,
    headings: [h('ABBR_HDNG', KR, 'X'), h('ABBR_CODE', KR, 'X'), h('ABBR_DESC', 'REQUIRED', 'X')],
  },
  {
    name: 'DICT',
    parent: undefined,
    headings: [
      h('DICT_TYPE', KR, 'PA'),
      h('DICT_GRP', KR, 'X'),
      h('DICT_HDNG', 'KEY', 'X'),
      h('DICT_STAT', 'OTHER', 'PA'),
      h('DICT_DTYP', 'OTHER', 'PT'),
      h('DICT_DESC', 'REQUIRED', 'X'),
      h('DICT_UNIT', 'OTHER', 'PU'),
      h('DICT_PGRP', 'OTHER', 'X'),
    ],
  },
  {
    name: 'LOCA',
    parent: 'PROJ',
    headings: [
      h('LOCA_ID', 'KEY', 'ID'),
      h('LOCA_TYPE', 'OTHER', 'PA'),
      h('LOCA_NATE', 'OTHER', '2DP', 'm'),
      h('LOCA_NATN', 'OTHER', '2DP', 'm'),
      h('LOCA_GREF', 'OTHER', 'PA'),
      h('LOCA_GL', 'OTHER', '2DP', 'm'),
      h('LOCA_FDEP', 'OTHER', '2DP', 'm'),
    ],
  },
  {
    name: 'HORN',
    parent: 'LOCA',
    headings: [
      h('LOCA_ID', 'KEY', 'ID'),
      h('HORN_TOP', 'KEY', '2DP', 'm'),
      h('HORN_BASE', 'KEY', '2DP', 'm'),
      h('HORN_ORNT', 'OTHER', '0DP', 'deg'),
      h('HORN_INCL', 'OTHER', '0DP', 'deg'),
    ],
  },
  {
    name: 'CORE',
    parent: 'LOCA',
    headings: [
      h('LOCA_ID', 'KEY', 'ID'),
      h('CORE_TOP', 'KEY', '2DP', 'm'),
      h('CORE_BASE', 'KEY', '2DP', 'm'),
      h('CORE_PREC', 'OTHER', '0DP', '%'),
      h('CORE_SREC', 'OTHER', '0DP', '%'),
      h('CORE_RQD', 'OTHER', '0DP', '%'),
      h('CORE_DIAM', 'OTHER', '0DP', 'mm'),
    ],
  },
  {
    name: 'DISC',
    parent: 'LOCA',
    headings: [
      h('LOCA_ID', 'KEY', 'ID'),
      h('DISC_TOP', 'KEY', '2DP', 'm'),
      h('DISC_BASE', 'KEY', '2DP', 'm'),
      h('FRAC_SET', 'KEY', 'X'),
      h('DISC_NUMB', 'KEY', 'X'),
      h('DISC_TYPE', 'OTHER', 'PA'),
      h('DISC_DIP', 'OTHER', 'X', 'deg'),
      h('DISC_DIR', 'OTHER', 'X', 'deg'),
      h('DISC_RGH', 'OTHER', 'X'),
      h('DISC_JRC', 'OTHER', '0DP'),
      h('DISC_APT', 'OTHER', 'XN', 'mm'),
      h('DISC_INFM', 'OTHER', 'X'),
      h('DISC_WETH', 'OTHER', 'X'),
      h('DISC_REM', 'OTHER', 'X'),
    ],
  },
  {
    name: 'FRAC',
    parent: 'LOCA',
    headings: [
      h('LOCA_ID', 'KEY', 'ID'),
      h('FRAC_FROM', 'KEY', '2DP', 'm'),
      h('FRAC_TO', 'KEY', '2DP', 'm'),
      h('FRAC_SET', 'KEY', 'X'),
      h('FRAC_IMAX', 'OTHER', 'XN', 'mm'),
      h('FRAC_IAVE', 'OTHER', 'XN', 'mm'),
      h('FRAC_IMIN', 'OTHER', 'XN', 'mm'),
      h('FRAC_FI', 'OTHER', 'XN'),
    ],
  },
]

/** Headings above that the writer leaves out: TRAN_RCON's default "+" applies (Rule 16a). */
export const readNotWritten: Readonly<Record<string, readonly string[]>> = { TRAN: ['TRAN_RCON'] }
