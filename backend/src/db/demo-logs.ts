import { holeAt } from '../../../orient/index'
import type { StructureInputT } from '../../../schema/index'
import { demoRandom } from './random'

interface Station {
  depth: number
  azimuth: number
  plunge: number
}

/**
 * A LAS 2.0 file for a demo hole: gamma ray, bulk density and caliper that follow the demo's
 * domains (the mudstone band reads hot and light), and the hole's deviation channels. Invented.
 */
export function demoLasFile(
  holeName: string,
  finalDepth: number,
  stations: readonly Station[],
): string {
  const random = demoRandom(`${holeName}:las`)
  const step = 0.1
  const start = 1.0
  const lines: string[] = []
  for (let d = start; d <= finalDepth - 0.5 + 1e-9; d += step) {
    const mud = d >= 70 && d < 130
    const gr = (mud ? 85 : 22) + (random() - 0.5) * (mud ? 20 : 10)
    const rhob = (mud ? 2.46 : 2.66) + (random() - 0.5) * 0.04
    const cali = 96 + (random() < 0.02 ? 8 + random() * 10 : random() * 1.5)
    const axis = holeAt(stations, d)!
    const nulls = d < 3
    const row = [
      d,
      nulls ? -999.25 : gr,
      nulls ? -999.25 : rhob,
      cali,
      90 - axis.plunge,
      axis.trend,
    ]
    lines.push(row.map((v, i) => (i === 0 ? v.toFixed(2) : v.toFixed(3))).join('  '))
  }
  const stop = start + (lines.length - 1) * step
  return [
    '~VERSION INFORMATION',
    ' VERS.                 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0',
    ' WRAP.                  NO : ONE LINE PER DEPTH STEP',
    '~WELL INFORMATION',
    ` STRT.M             ${start.toFixed(2)} : START DEPTH`,
    ` STOP.M             ${stop.toFixed(2)} : STOP DEPTH`,
    ` STEP.M             ${step.toFixed(2)} : STEP`,
    ' NULL.            -999.25 : NULL VALUE',
    ' COMP.   Greyscar Quarry Ltd (demo) : COMPANY',
    ` WELL.   ${holeName} : WELL`,
    ' FLD .   Greyscar Quarry north wall : FIELD',
    ' SRVC.   Downdip demo logging : SERVICE COMPANY',
    ' DATE.   2026-06-10 : LOG DATE',
    '~CURVE INFORMATION',
    ' DEPT.M                    : MEASURED DEPTH',
    ' GR  .GAPI                 : GAMMA RAY',
    ' RHOB.G/C3                 : BULK DENSITY',
    ' CALI.MM                   : CALIPER',
    ' DEVI.DEG                  : HOLE INCLINATION FROM VERTICAL',
    ' AZI .DEG                  : HOLE AZIMUTH (TRUE)',
    '~PARAMETER INFORMATION',
    ' BS  .MM             96.0 : BIT SIZE',
    '~A  DEPT  GR  RHOB  CALI  DEVI  AZI',
    ...lines,
    '',
  ].join('\n')
}

/**
 * How a demo hole's image log sits against its core: the log depth offset (image − core, m) and a
 * run whose orientation line was drawn wrongly, so the image sees its betas `rotation` degrees
 * further round than logged. GSQ-BH05 is the hole where reconciliation has something to show.
 */
export function demoImageOffset(holeName: string) {
  return holeName === 'GSQ-BH05'
    ? { depth: 0.35, wrongRun: { from: 93, to: 96, rotation: 25 } }
    : { depth: 0.04, wrongRun: null }
}

/** The beta the image sees for a core structure logged with `beta` at `depth`. */
export function demoImageBeta(holeName: string, depth: number, beta: number): number {
  const run = demoImageOffset(holeName).wrongRun
  return run && depth >= run.from && depth < run.to ? beta + run.rotation : beta
}

/**
 * Televiewer picks for a demo hole: the oriented core structures seen again on the image log, a few
 * centimetres deeper (log depth vs driller's depth; more in GSQ-BH05), as high-side sinusoids on a
 * 96 mm hole: H = D·tan(90° − alpha) and trough = beta + 180 (beta from the bottom of hole).
 */
export function demoPicks(holeName: string, structures: readonly StructureInputT[]) {
  const random = demoRandom(`${holeName}:picks`)
  const diameter = 96
  const offset = demoImageOffset(holeName).depth
  return structures
    .filter((s) => s.alpha !== undefined && s.beta !== undefined && s.alpha > 3 && random() < 0.8)
    .map((s) => ({
      depth: Math.round((s.depth + offset + (random() - 0.5) * 0.02) * 1000) / 1000,
      type: s.type,
      amplitude:
        Math.round(
          diameter * Math.tan(((90 - s.alpha! + (random() - 0.5) * 3) * Math.PI) / 180) * 10,
        ) / 10,
      diameter,
      troughAzimuth: Math.round(
        (demoImageBeta(holeName, s.depth, s.beta!) + 180 + (random() - 0.5) * 6 + 360) % 360,
      ),
      quality: random() < 0.15 ? 'poor' : 'good',
    }))
}
