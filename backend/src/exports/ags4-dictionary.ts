import { groupsWeWrite, readNotWritten } from './ags4-groups-we-write'
import { BUILT_IN_EDITION, type AgsStatus } from './ags4-standard'
import { userHeadings } from './ags4-user-headings'

export type { AgsStatus } from './ags4-standard'

/** A heading as Downdip writes it: status, data type and unit, and its DICT description. */
export interface AgsHeading {
  name: string
  type: string
  unit: string
  status: AgsStatus
  description: string
  /** Not in the standard dictionary: declared in the file's DICT group, written after the rest. */
  user?: boolean
}

/** The edition Downdip writes: the one its built-in groups follow. */
export const AGS_EDITION = BUILT_IN_EDITION

/** The user-defined group of set summaries (one row per set per interval). */
export const SET_GROUP = 'DSET'
/** The user-defined group of interval sign-off and analysis settings (one row per interval). */
export const INTERVAL_GROUP = 'DINT'
/** Our user-defined groups: DICT description and parent group. */
export const userGroups: Record<string, { description: string; parent: string }> = {
  [SET_GROUP]: {
    description: 'Downdip discontinuity set summary per depth interval',
    parent: 'LOCA',
  },
  [INTERVAL_GROUP]: {
    description: 'Downdip depth interval: sign-off and the analysis settings used',
    parent: 'LOCA',
  },
}

/** A group's standard headings (order, status, type and unit from ags4-groups-we-write.ts), then ours. */
function build(group: string): AgsHeading[] {
  const skip = readNotWritten[group] ?? []
  const standard = (groupsWeWrite.find((g) => g.name === group)?.headings ?? [])
    .filter((h) => !skip.includes(h.name))
    .map((h) => ({ ...h, description: '' }))
  return [...standard, ...(userHeadings[group] ?? []).map((h) => ({ ...h, user: true }))]
}

/** Every group Downdip writes, its headings in the order they are written. */
export const agsGroups: Record<string, AgsHeading[]> = Object.fromEntries(
  [...groupsWeWrite.map((g) => g.name), ...Object.keys(userGroups)].map((g) => [g, build(g)]),
)

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
  PT: 'Text listed in TYPE',
  PU: 'Text listed in UNIT',
  DT: 'Date time in the format of the UNIT row',
  '0DP': 'Value; 0 decimal places',
  '1DP': 'Value; 1 decimal place',
  '2DP': 'Value; 2 decimal places',
  '3DP': 'Value; 3 decimal places',
  '4DP': 'Value; 4 decimal places',
}
