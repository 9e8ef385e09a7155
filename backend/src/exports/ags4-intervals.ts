import { INTERVAL_GROUP } from './ags4-dictionary'
import { dp, headingsOf, type AgsTable } from './ags4-format'
import type { PackData } from './pack-types'

/** AGS4 DT in the UNIT `yyyy-mm-ddThh:mm`, UTC; blank when the step was not taken. */
const dateTime = (at: Date | null) => (at ? at.toISOString().slice(0, 16) : '')

/** One row per packed interval: who checked and approved it, when, and the settings its sets used. */
export function intervalTable(data: PackData): AgsTable {
  return {
    name: INTERVAL_GROUP,
    headings: headingsOf(INTERVAL_GROUP),
    rows: data.intervals.map(({ interval, hole, settings, signOff }) => ({
      LOCA_ID: hole.name,
      DINT_TOP: dp(interval.fromDepth, 2),
      DINT_BASE: dp(interval.toDepth, 2),
      DINT_NAME: interval.name,
      DINT_STAT: interval.status,
      DINT_CHKB: signOff.checkedBy ?? '',
      DINT_CHKD: dateTime(signOff.checkedAt),
      DINT_APPB: signOff.approvedBy ?? '',
      DINT_APPD: dateTime(signOff.approvedAt),
      DINT_WGHT: settings.weighting,
      DINT_CONT: settings.contourMethod,
      DINT_FDIP: dp(settings.faceDip, 2),
      DINT_FDIR: dp(settings.faceDipDirection, 2),
      DINT_FRIC: dp(settings.frictionDeg, 2),
      DINT_LATL: dp(settings.lateralLimitDeg, 2),
      DINT_TOPL: dp(settings.topplingLimitDeg, 2),
    })),
  }
}
