import Papa from 'papaparse'
import { setColour } from '../../../schema/vocabulary'
import type { PackData } from './pack-types'
import { neutraliseCell, neutraliseLine } from './cell-safety'

type Cell = string | number | null | undefined
const fixed = (x: number | null | undefined, d: number) =>
  x === null || x === undefined || !Number.isFinite(x) ? '' : x.toFixed(d)

/**
 * A CSV (CRLF) whose first lines are `# ` comments (the pack's header: draft mark, sign-off,
 * settings, cautions), then the column header row and the data rows; readers that skip `#` lines
 * (e.g. Papa.parse with `comments: '#'`) see a plain table. Text cells are neutralised against
 * spreadsheet formula injection (cell-safety.ts); numbers are written as numbers.
 */
function toCsv(header: string[], rows: Cell[][], preamble: readonly string[]): string {
  const safe = (c: Cell) => (typeof c === 'string' ? neutraliseCell(c) : (c ?? ''))
  return (
    preamble.map((line) => `# ${neutraliseLine(line)}\r\n`).join('') +
    Papa.unparse(
      { fields: header, data: rows.map((r) => r.map(safe)) },
      {
        newline: '\r\n',
      },
    ) +
    '\r\n'
  )
}

/** One row per structure: inputs, conventions, computed orientation, position, weight, set. */
export function structuresCsv(data: PackData, preamble: readonly string[] = []): string {
  const holeName = new Map(data.holes.map((h) => [h.id, h.name]))
  const header = [
    'hole',
    'depth_m',
    'type',
    'source',
    'alpha_deg',
    'beta_deg',
    'gamma_deg',
    'gamma_convention',
    'reference_line',
    'input_dip_deg',
    'input_dip_direction_deg',
    'pick_amplitude_mm',
    'pick_diameter_mm',
    'pick_trough_azimuth_deg',
    'pick_reference',
    'declination_applied_deg',
    'survey_revision',
    'dip_deg',
    'dip_direction_deg',
    'pole_trend_deg',
    'pole_plunge_deg',
    'east_m',
    'north_m',
    'elevation_m',
    'terzaghi_weight',
    'flags',
    'beta_rotation_applied_deg',
    'depth_shift_applied_m',
    'uncertainty95_deg',
    'uncertainty_major95_deg',
    'uncertainty_minor95_deg',
    'uncertainty_reasons',
    'interval',
    'set',
    'structure_id',
  ]
  const rows = data.structures.map((s) => {
    const a = data.assignment.get(s.id)
    return [
      holeName.get(s.holeId),
      fixed(s.depth, 3),
      s.type,
      s.source,
      fixed(s.alpha, 1),
      fixed(s.beta, 1),
      fixed(s.gamma, 1),
      s.gammaConvention,
      s.referenceLine,
      fixed(s.inputDip, 1),
      fixed(s.inputDipDirection, 1),
      fixed(s.pickAmplitude, 1),
      fixed(s.pickDiameter, 1),
      fixed(s.pickTroughAzimuth, 1),
      s.pickReference,
      fixed(s.declinationApplied, 2),
      s.surveyRevision,
      fixed(s.dip, 2),
      fixed(s.dipDirection, 2),
      fixed(s.poleTrend, 2),
      fixed(s.polePlunge, 2),
      fixed(s.east, 2),
      fixed(s.north, 2),
      fixed(s.elevation, 2),
      fixed(s.terzaghiWeight, 3),
      s.flags.join(';'),
      fixed(s.betaRotationApplied, 2),
      fixed(s.depthShiftApplied, 3),
      fixed(s.uncertainty95, 2),
      fixed(s.uncertaintyMajor, 2),
      fixed(s.uncertaintyMinor, 2),
      s.uncertaintyReasons.join(';'),
      a?.interval ?? '',
      a?.set ?? '',
      s.id,
    ]
  })
  return toCsv(header, rows, preamble)
}

/**
 * Per interval set: counts, mean, Fisher statistics (weighted as the interval's settings say), true
 * spacing; the interval's RQD and frequency; the set's colour on the nets (the screen's palette).
 */
export function setsCsv(data: PackData, preamble: readonly string[] = []): string {
  const header = [
    'hole',
    'interval',
    'from_m',
    'to_m',
    'domain',
    'set',
    'count',
    'weighted_count',
    'weighting',
    'percent_of_oriented',
    'mean_dip_deg',
    'mean_dip_direction_deg',
    'mean_pole_trend_deg',
    'mean_pole_plunge_deg',
    'fisher_k',
    'alpha95_deg',
    'systematic95_deg',
    'uncertainty95_deg',
    'spherical_variance',
    'apparent_spacing_m',
    'true_spacing_m',
    'isrm_spacing_class',
    'interval_rqd_pct',
    'interval_fracture_frequency_per_m',
    'set_colour',
  ]
  const rows: Cell[][] = []
  for (const p of data.intervals) {
    for (const [i, s] of p.analysis.sets.entries()) {
      rows.push([
        p.hole.name,
        p.interval.name,
        fixed(p.interval.fromDepth, 2),
        fixed(p.interval.toDepth, 2),
        p.domain,
        s.name,
        s.count,
        fixed(s.weightedCount, 1),
        p.settings.weighting,
        fixed(s.percent, 1),
        fixed(s.mean?.dip, 2),
        fixed(s.mean?.dipDirection, 2),
        fixed(s.meanPole?.trend, 2),
        fixed(s.meanPole?.plunge, 2),
        fixed(s.kappa, 1),
        fixed(s.alpha95, 2),
        fixed(s.systematic95, 2),
        fixed(s.uncertainty95, 2),
        fixed(s.sphericalVariance, 4),
        fixed(s.spacing?.apparent, 3),
        fixed(s.spacing?.true, 3),
        s.spacing?.isrmClass ?? '',
        fixed(p.runs.rqd, 1),
        fixed(p.runs.frequency, 2),
        setColour(i),
      ])
    }
  }
  return toCsv(header, rows, preamble)
}

/** Every set pair of every interval: the line of intersection and the angle between the planes. */
export function intersectionsCsv(data: PackData, preamble: readonly string[] = []): string {
  const header = [
    'hole',
    'interval',
    'set_a',
    'set_b',
    'trend_deg',
    'plunge_deg',
    'angle_between_planes_deg',
  ]
  const rows = data.intervals.flatMap((p) =>
    p.analysis.intersections.map((x) => [
      p.hole.name,
      p.interval.name,
      x.nameA,
      x.nameB,
      fixed(x.trend, 2),
      fixed(x.plunge, 2),
      fixed(x.angle, 2),
    ]),
  )
  return toCsv(header, rows, preamble)
}
