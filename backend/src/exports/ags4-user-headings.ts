import type { AgsStatus } from './ags4-standard'

export interface UserHeading {
  name: string
  type: string
  unit: string
  status: AgsStatus
  description: string
}

const u = (
  name: string,
  type: string,
  unit: string,
  description: string,
  status: AgsStatus = 'OTHER',
): UserHeading => ({ name, type, unit, status, description })

/**
 * Headings the standard dictionary has no place for, declared in the file's DICT group in this
 * order (Rule 18a): what Downdip adds to DISC, and its own groups DSET and DINT.
 */
export const userHeadings: Record<string, UserHeading[]> = {
  DISC: [
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
    u('DISC_U95', '2DP', 'deg', 'Monte Carlo 95% cone half-angle about the pole'),
    u('DISC_UWHY', 'X', '', 'Why the cone is large, semicolon separated'),
    u('DISC_ROTN', '2DP', 'deg', 'Core run orientation-line rotation added to beta'),
    u('DISC_DSHF', '3DP', 'm', 'Image depth shift applied (image minus core depth)'),
    // DISC_PERS is a measured length (1DP, m); the class logged on core is not one.
    u('DISC_PRCL', 'X', '', 'ISRM (1978) persistence class; not determined on core'),
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
    u('DSET_SY95', '2DP', 'deg', '95% cone of the mean from survey error shared by the hole'),
    u('DSET_U95', '2DP', 'deg', 'Combined 95% cone of the mean (alpha95 and survey)'),
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
