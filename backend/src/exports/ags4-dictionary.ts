/**
 * The AGS4 groups and headings Downdip writes, in dictionary order, with their status, data type
 * and unit. Only what we use is encoded here (the AGS4 data dictionary itself is © AGS and is not
 * shipped). User-defined headings (flagged `user`) are declared in the file's DICT group.
 */
export type AgsStatus = 'KEY' | 'REQUIRED' | 'OTHER'
export interface AgsHeading {
  name: string
  type: string
  unit: string
  status: AgsStatus
  description: string
  /** Not in the AGS4 dictionary: declared in DICT and written after the standard headings. */
  user?: boolean
}

export const AGS_EDITION = '4.1.1'

const h = (
  name: string,
  type: string,
  unit = '',
  status: AgsStatus = 'OTHER',
  description = '',
  user = false,
): AgsHeading => ({ name, type, unit, status, description, user })
const u = (
  name: string,
  type: string,
  unit: string,
  description: string,
  status: AgsStatus = 'OTHER',
) => h(name, type, unit, status, description, true)

export const agsGroups: Record<string, AgsHeading[]> = {
  PROJ: [
    h('PROJ_ID', 'ID', '', 'KEY'),
    h('PROJ_NAME', 'X'),
    h('PROJ_LOC', 'X'),
    h('PROJ_CLNT', 'X'),
    h('PROJ_ENG', 'X'),
    h('PROJ_MEMO', 'X'),
  ],
  TRAN: [
    h('TRAN_ISNO', 'X', '', 'KEY'),
    h('TRAN_DATE', 'DT', 'yyyy-mm-dd', 'REQUIRED'),
    h('TRAN_PROD', 'X', '', 'REQUIRED'),
    h('TRAN_STAT', 'X', '', 'REQUIRED'),
    h('TRAN_AGS', 'X', '', 'REQUIRED'),
    h('TRAN_RECV', 'X'),
    h('TRAN_DLIM', 'X', '', 'REQUIRED'),
    h('TRAN_RCON', 'X', '', 'REQUIRED'),
  ],
  UNIT: [h('UNIT_UNIT', 'X', '', 'KEY'), h('UNIT_DESC', 'X')],
  TYPE: [h('TYPE_TYPE', 'X', '', 'KEY'), h('TYPE_DESC', 'X')],
  ABBR: [h('ABBR_HDNG', 'X', '', 'KEY'), h('ABBR_CODE', 'X', '', 'KEY'), h('ABBR_DESC', 'X')],
  DICT: [
    h('DICT_TYPE', 'PA', '', 'KEY'),
    h('DICT_GRP', 'X', '', 'KEY'),
    h('DICT_HDNG', 'X', '', 'KEY'),
    h('DICT_STAT', 'PA'),
    h('DICT_DTYP', 'X'),
    h('DICT_DESC', 'X'),
    h('DICT_UNIT', 'X'),
    h('DICT_PGRP', 'X'),
  ],
  LOCA: [
    h('LOCA_ID', 'ID', '', 'KEY'),
    h('LOCA_TYPE', 'PA'),
    h('LOCA_NATE', '2DP', 'm'),
    h('LOCA_NATN', '2DP', 'm'),
    h('LOCA_GL', '2DP', 'm'),
    h('LOCA_FDEP', '2DP', 'm'),
    h('LOCA_GREF', 'X'),
  ],
  HORN: [
    h('LOCA_ID', 'ID', '', 'KEY'),
    h('HORN_TOP', '2DP', 'm', 'KEY'),
    h('HORN_BASE', '2DP', 'm', 'KEY'),
    h('HORN_ORNT', '0DP', 'deg'),
    h('HORN_INCL', '0DP', 'deg'),
  ],
  CORE: [
    h('LOCA_ID', 'ID', '', 'KEY'),
    h('CORE_TOP', '2DP', 'm', 'KEY'),
    h('CORE_BASE', '2DP', 'm'),
    h('CORE_PREC', '0DP', '%'),
    h('CORE_SREC', '0DP', '%'),
    h('CORE_RQD', '0DP', '%'),
    h('CORE_DIAM', '0DP', 'mm'),
  ],
  DISC: [
    h('LOCA_ID', 'ID', '', 'KEY'),
    h('DISC_TOP', '2DP', 'm', 'KEY'),
    h('DISC_BASE', '2DP', 'm', 'KEY'),
    h('FRAC_SET', 'X', '', 'KEY'),
    h('DISC_NUMB', 'X', '', 'KEY'),
    h('DISC_TYPE', 'PA'),
    h('DISC_DIP', 'X', 'deg'),
    h('DISC_DIR', 'X', 'deg'),
    h('DISC_RGH', 'X'),
    h('DISC_JRC', 'X'),
    h('DISC_APT', 'X', 'mm'),
    h('DISC_INFM', 'X'),
    h('DISC_PERS', 'X'),
    h('DISC_WETH', 'X'),
    h('DISC_REM', 'X'),
    u('DISC_ALPH', '1DP', 'deg', 'Core alpha angle: core axis to ellipse long axis'),
    u(
      'DISC_BETA',
      '1DP',
      'deg',
      'Core beta angle: clockwise looking down-hole from the reference line',
    ),
    u('DISC_REFL', 'X', '', 'Reference line of beta (bottom or top of hole)'),
    u('DISC_OCNF', 'X', '', 'Orientation-mark confidence of the core run'),
    u('DISC_SRC', 'X', '', 'Source of the measurement: core, image or true'),
    u('DISC_INTV', 'X', '', 'Downdip depth interval holding the discontinuity'),
    u('DISC_TWGT', '3DP', '', 'Terzaghi weight 1/abs(cos delta), capped at 10'),
    u('DISC_FLAG', 'X', '', 'Data-quality flags, semicolon separated'),
  ],
  FRAC: [
    h('LOCA_ID', 'ID', '', 'KEY'),
    h('FRAC_FROM', '2DP', 'm', 'KEY'),
    h('FRAC_TO', '2DP', 'm', 'KEY'),
    h('FRAC_SET', 'X', '', 'KEY'),
    h('FRAC_IMAX', '0DP', 'mm'),
    h('FRAC_IAVE', '0DP', 'mm'),
    h('FRAC_IMIN', '0DP', 'mm'),
    h('FRAC_FI', 'XN', '1/m'),
  ],
  DSET: [
    u('LOCA_ID', 'ID', '', 'Location identifier', 'KEY'),
    u('DSET_TOP', '2DP', 'm', 'Top of the interval', 'KEY'),
    u('DSET_BASE', '2DP', 'm', 'Base of the interval', 'KEY'),
    u('DSET_SET', 'X', '', 'Set name within the interval', 'KEY'),
    u('DSET_INTV', 'X', '', 'Interval name'),
    u('DSET_DOMN', 'X', '', 'Geotechnical domain'),
    u('DSET_NRAW', '0DP', '', 'Number of oriented members'),
    u('DSET_NWGT', '1DP', '', 'Weighted number of members (weighting as DINT_WGHT)'),
    u('DSET_PCT', '1DP', '%', 'Members as % of oriented data in the interval'),
    u('DSET_DIP', '2DP', 'deg', 'Mean dip (Fisher mean, weighting as DINT_WGHT)'),
    u('DSET_DIR', '2DP', 'deg', 'Mean dip direction'),
    u('DSET_FK', '1DP', '', 'Fisher concentration K'),
    u('DSET_A95', '2DP', 'deg', 'Fisher alpha95 cone of confidence'),
    u('DSET_SVAR', '4DP', '', 'Spherical variance'),
    u('DSET_SPAC', '3DP', 'm', 'Mean true spacing'),
    u('DSET_SCLS', 'X', '', 'ISRM (1978) spacing class'),
    u('DSET_RQD', '1DP', '%', 'Interval RQD, length-weighted over core runs'),
    u('DSET_FI', '2DP', '1/m', 'Interval natural fracture frequency'),
  ],
  DINT: [
    u('LOCA_ID', 'ID', '', 'Location identifier', 'KEY'),
    u('DINT_TOP', '2DP', 'm', 'Top of the interval', 'KEY'),
    u('DINT_BASE', '2DP', 'm', 'Base of the interval', 'KEY'),
    u('DINT_NAME', 'X', '', 'Interval name'),
    u('DINT_STAT', 'X', '', 'Review status when the pack was built'),
    u('DINT_CHKB', 'X', '', 'Checked by'),
    u('DINT_CHKD', 'DT', 'yyyy-mm-ddThh:mm', 'Checked at (UTC)'),
    u('DINT_APPB', 'X', '', 'Approved by'),
    u('DINT_APPD', 'DT', 'yyyy-mm-ddThh:mm', 'Approved at (UTC)'),
    u('DINT_WGHT', 'X', '', 'Weighting of the set statistics (terzaghi or none)'),
    u('DINT_CONT', 'X', '', 'Density contour method (kamb or exponential)'),
    u('DINT_FDIP', '2DP', 'deg', 'Design face dip'),
    u('DINT_FDIR', '2DP', 'deg', 'Design face dip direction'),
    u('DINT_FRIC', '2DP', 'deg', 'Friction angle of the kinematic screening'),
    u('DINT_LATL', '2DP', 'deg', 'Lateral limit of planar and wedge sliding'),
    u('DINT_TOPL', '2DP', 'deg', 'Limit of flexural toppling'),
  ],
}

/** The user-defined group of set summaries (one row per set per interval). */
export const SET_GROUP = 'DSET'
/** The user-defined group of interval sign-off and analysis settings (one row per interval). */
export const INTERVAL_GROUP = 'DINT'
/** Our user-defined groups, with their DICT descriptions. */
export const userGroups: Record<string, string> = {
  [SET_GROUP]: 'Downdip discontinuity set summary per depth interval',
  [INTERVAL_GROUP]: 'Downdip depth interval: sign-off and the analysis settings used',
}

export const unitDescriptions: Record<string, string> = {
  m: 'metre',
  mm: 'millimetre',
  deg: 'degree',
  '%': 'percent',
  '1/m': 'per metre',
  'yyyy-mm-dd': 'date: year-month-day',
  'yyyy-mm-ddThh:mm': 'date and time (UTC): year-month-day T hour:minute',
}

export const typeDescriptions: Record<string, string> = {
  ID: 'Unique identifier',
  X: 'Text',
  XN: 'Text or numeric',
  PA: 'Text listed in ABBR',
  DT: 'Date time in the format of the UNIT row',
  '0DP': 'Value; 0 decimal places',
  '1DP': 'Value; 1 decimal place',
  '2DP': 'Value; 2 decimal places',
  '3DP': 'Value; 3 decimal places',
  '4DP': 'Value; 4 decimal places',
}
