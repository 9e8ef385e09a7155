import type { AnalysisSettingKey, AnalysisSettings } from '../../api/interval-types'
import { formatAngle, formatAzimuth } from '../format'

/** The settings line's items, in order; the design face is one item of two settings. */
export const settingItems: { key: string; label: string; keys: AnalysisSettingKey[] }[] = [
  { key: 'weighting', label: 'Statistics', keys: ['weighting'] },
  { key: 'contourMethod', label: 'Contours', keys: ['contourMethod'] },
  { key: 'face', label: 'Design face', keys: ['faceDip', 'faceDipDirection'] },
  { key: 'frictionDeg', label: 'Friction', keys: ['frictionDeg'] },
  { key: 'lateralLimitDeg', label: 'Lateral limit', keys: ['lateralLimitDeg'] },
  { key: 'topplingLimitDeg', label: 'Toppling limit', keys: ['topplingLimitDeg'] },
]

/** One item of the settings line in words. */
export function describeSetting(key: string, s: AnalysisSettings): string {
  switch (key) {
    case 'weighting':
      return s.weighting === 'terzaghi' ? 'Terzaghi-weighted' : 'unweighted'
    case 'contourMethod':
      return s.contourMethod === 'kamb' ? 'Kamb' : 'kernel'
    case 'face':
      return s.faceDip === null || s.faceDipDirection === null
        ? 'none'
        : `${formatAngle(s.faceDip)}/${formatAzimuth(s.faceDipDirection)}`
    case 'frictionDeg':
      return s.frictionDeg === null ? 'none' : formatAngle(s.frictionDeg)
    case 'lateralLimitDeg':
      return `±${formatAngle(s.lateralLimitDeg)}`
    case 'topplingLimitDeg':
      return `±${formatAngle(s.topplingLimitDeg)}`
    default:
      return ''
  }
}
