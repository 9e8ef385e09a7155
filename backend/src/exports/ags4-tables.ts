import type { PackData } from './pack-types'
import { dp, headingsOf, type AgsTable } from './ags4-format'
import { SET_GROUP } from './ags4-dictionary'

/** Our structure types as DISC_TYPE codes: only `Joint` is standard, the rest are defined in ABBR. */
export const discTypeCodes: Record<string, [string, string]> = {
  joint: ['Joint', 'Joint'],
  bedding: ['Bedding', 'Bedding plane'],
  foliation: ['Foliation', 'Foliation plane'],
  fault: ['Fault', 'Fault'],
  vein: ['Vein', 'Vein'],
  shear: ['Shear', 'Shear surface'],
  contact: ['Contact', 'Lithological contact'],
  cleavage: ['Cleavage', 'Cleavage plane'],
  'broken-zone': ['BrokenZone', 'Broken zone'],
}

/** Nominal core diameters, mm (common practice). */
const coreDiameters: Record<string, number> = {
  NQ: 47.6,
  NQ3: 45.0,
  HQ: 63.5,
  HQ3: 61.1,
  PQ: 85.0,
  PQ3: 83.0,
}

export const UNASSIGNED_SET = 'unassigned'

const hole = (data: PackData) => new Map(data.holes.map((h) => [h.id, h.name]))

export function locaTable(data: PackData): AgsTable {
  return {
    name: 'LOCA',
    headings: headingsOf('LOCA'),
    rows: data.holes.map((h) => ({
      LOCA_ID: h.name,
      LOCA_TYPE: 'RC',
      LOCA_NATE: dp(h.collarEast, 2),
      LOCA_NATN: dp(h.collarNorth, 2),
      LOCA_GL: dp(h.collarElevation, 2),
      LOCA_FDEP: dp(h.finalDepth, 2),
      LOCA_GREF: `EPSG:${data.project.crsEpsg}`,
    })),
  }
}

/** Hole orientation by section: each survey station holds until the next (or the final depth). */
export function hornTable(data: PackData): AgsTable {
  const rows = data.holes.flatMap((h) => {
    const st = data.stations.filter((s) => s.holeId === h.id)
    return st
      .map((s, i) => ({ s, base: i + 1 < st.length ? st[i + 1].depth : h.finalDepth }))
      .filter(({ s, base }) => base > s.depth)
      .map(({ s, base }) => ({
        LOCA_ID: h.name,
        HORN_TOP: dp(s.depth, 2),
        HORN_BASE: dp(base, 2),
        HORN_ORNT: dp(s.azimuth, 0),
        HORN_INCL: dp(s.plunge, 0),
      }))
  })
  return { name: 'HORN', headings: headingsOf('HORN'), rows }
}

export function coreTable(data: PackData): AgsTable {
  const rows = data.holes.flatMap((h) =>
    (data.runs.get(h.id) ?? []).map((r) => ({
      LOCA_ID: h.name,
      CORE_TOP: dp(r.fromDepth, 2),
      CORE_BASE: dp(r.toDepth, 2),
      CORE_PREC: dp(r.metrics?.tcr, 0),
      CORE_SREC: dp(r.metrics?.scr, 0),
      CORE_RQD: dp(r.metrics?.rqd, 0),
      CORE_DIAM: dp(coreDiameters[h.coreSize], 0),
    })),
  )
  return { name: 'CORE', headings: headingsOf('CORE'), rows }
}

export function discTable(data: PackData): AgsTable {
  const names = hole(data)
  const counter = new Map<number, number>()
  const rows = data.structures.map((s) => {
    const n = (counter.get(s.holeId) ?? 0) + 1
    counter.set(s.holeId, n)
    const a = data.assignment.get(s.id)
    const run = (data.runs.get(s.holeId) ?? []).find(
      (r) => s.depth >= r.fromDepth && s.depth < r.toDepth,
    )
    return {
      LOCA_ID: names.get(s.holeId) ?? '',
      DISC_TOP: dp(s.depth, 2),
      DISC_BASE: dp(s.depth, 2),
      FRAC_SET: a?.set || UNASSIGNED_SET,
      DISC_NUMB: String(n),
      DISC_TYPE: discTypeCodes[s.type]?.[0] ?? s.type,
      DISC_DIP: dp(s.dip, 2),
      DISC_DIR: dp(s.dipDirection, 2),
      DISC_RGH: s.roughness ?? '',
      // DISC_JRC is 0DP in the dictionary: JRC is read off the Barton and Choubey (1977)
      // profiles to the nearest whole number (common practice).
      DISC_JRC: dp(s.jrc, 0),
      DISC_APT: dp(s.apertureMm, 1),
      DISC_INFM: s.infillType ?? '',
      DISC_WETH: s.wallWeathering ?? '',
      DISC_REM: s.comment,
      DISC_ALPH: dp(s.alpha, 1),
      DISC_BETA: dp(s.beta, 1),
      DISC_REFL: s.referenceLine ?? '',
      DISC_OCNF: s.source === 'core' ? (run?.markConfidence ?? '') : '',
      DISC_SRC: s.source,
      DISC_INTV: a?.interval ?? '',
      DISC_TWGT: dp(s.terzaghiWeight, 3),
      DISC_FLAG: s.flags.join(';'),
      DISC_U95: dp(s.uncertainty95, 2),
      DISC_UWHY: s.uncertaintyReasons.join(';'),
      DISC_ROTN: dp(s.betaRotationApplied, 2),
      DISC_DSHF: s.source === 'image' ? dp(s.depthShiftApplied, 3) : '',
      // Persistence cannot be measured on core: say so rather than leave it blank.
      DISC_PRCL: s.persistence ?? 'not determined',
    }
  })
  return { name: 'DISC', headings: headingsOf('DISC'), rows }
}

/** Fracture frequency per interval (set `all`) and per set (mean true spacing, count per metre). */
export function fracTable(data: PackData): AgsTable {
  const rows = data.intervals.flatMap(({ interval, hole: h, analysis, runs }) => {
    const base = {
      LOCA_ID: h.name,
      FRAC_FROM: dp(interval.fromDepth, 2),
      FRAC_TO: dp(interval.toDepth, 2),
    }
    const length = interval.toDepth - interval.fromDepth
    return [
      { ...base, FRAC_SET: 'all', FRAC_FI: dp(runs.frequency, 2) },
      ...analysis.sets.map((s) => ({
        ...base,
        FRAC_SET: s.name,
        FRAC_IAVE: dp(
          s.spacing?.true === undefined || s.spacing?.true === null ? null : s.spacing.true * 1000,
          0,
        ),
        FRAC_FI: dp(s.count / length, 2),
      })),
    ]
  })
  return { name: 'FRAC', headings: headingsOf('FRAC'), rows }
}

/** Our user-defined set summary group: the numbers of the interval's set table. */
export function setTable(data: PackData): AgsTable {
  const rows = data.intervals.flatMap(({ interval, hole: h, domain, analysis, runs }) =>
    analysis.sets.map((s) => ({
      LOCA_ID: h.name,
      DSET_TOP: dp(interval.fromDepth, 2),
      DSET_BASE: dp(interval.toDepth, 2),
      DSET_SET: s.name,
      DSET_INTV: interval.name,
      DSET_DOMN: domain,
      DSET_NRAW: String(s.count),
      DSET_NWGT: dp(s.weightedCount, 1),
      DSET_PCT: dp(s.percent, 1),
      DSET_DIP: dp(s.mean?.dip, 2),
      DSET_DIR: dp(s.mean?.dipDirection, 2),
      DSET_FK: dp(s.kappa, 1),
      DSET_A95: dp(s.alpha95, 2),
      DSET_SY95: dp(s.systematic95, 2),
      DSET_U95: dp(s.uncertainty95, 2),
      DSET_SVAR: dp(s.sphericalVariance, 4),
      DSET_SPAC: dp(s.spacing?.true, 3),
      DSET_SCLS: s.spacing?.isrmClass ?? '',
      DSET_RQD: dp(runs.rqd, 1),
      DSET_FI: dp(runs.frequency, 2),
    })),
  )
  return { name: SET_GROUP, headings: headingsOf(SET_GROUP), rows }
}
