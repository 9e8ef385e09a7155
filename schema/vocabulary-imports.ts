/**
 * What each CSV import kind reads and asks, once for the server (column mapping, option schemas)
 * and the import screen (mapping table, option selects): the target fields with the column names
 * that suggest them, and the file's conventions with their values, labels and the value assumed
 * when the upload does not say. Re-exported by vocabulary.ts; only types are imported back, so
 * there is no cycle at run time.
 */
import type { AzimuthReference, CsvImportKind, EnteredSource, ReferenceLine } from './vocabulary'

/** A target field: the API's name, its label, how a cell is read, header names that suggest it. */
export interface ImportFieldSpec {
  name: string
  label: string
  kind: 'number' | 'text'
  required: boolean
  aliases: string[]
}

/** A convention of the file: its values with labels, and the one assumed when none is sent. */
export interface ImportOptionSpec<V extends string = string> {
  key: string
  label: string
  choices: { value: V; label: string }[]
  initial: V
}

/** An option left to the project's setting: the screen does not send the key. */
export const PROJECT_SETTING = 'project'

export const depthUnits = ['m', 'ft'] as const
export type DepthUnit = (typeof depthUnits)[number]
/** 'core-axis-to-pole' files hold 90 − alpha. */
export const alphaConventions = ['alpha', 'core-axis-to-pole'] as const
/** 'up-hole' files measure beta to the up-hole apex: beta ± 180. */
export const betaApexes = ['down-hole', 'up-hole'] as const
/** How a survey file gives inclination: plunge positive down, dip negative down, or from vertical. */
export const plungeConventions = [
  'plunge-down',
  'dip-negative-down',
  'inclination-from-vertical',
] as const
export type PlungeConvention = (typeof plungeConventions)[number]
/** Image azimuths of picks are read from the high side of the hole or from north. */
export const imageAzimuthReferences = ['highside', 'north'] as const
export const northReferences = ['magnetic', 'true'] as const
export const pickLengthUnits = ['mm', 'm', 'in'] as const

/** The choices in the order of `labels`, whose keys must be exactly the option's values. */
function option<V extends string>(
  key: string,
  label: string,
  labels: Record<V, string>,
  initial: V,
): ImportOptionSpec<V> {
  const choices = (Object.keys(labels) as V[]).map((value) => ({ value, label: labels[value] }))
  return { key, label, choices, initial }
}

const depthUnit = option<DepthUnit>(
  'depthUnit',
  'Depths in',
  { m: 'metres', ft: 'feet (converted to metres)' },
  'm',
)

/** The conventions each kind asks about, in the order the import screen shows them. */
export const importOptionSpecs = {
  structures: {
    mode: option<EnteredSource>(
      'mode',
      'Orientation given as',
      { core: 'core angles α, β', true: 'true dip, dip direction' },
      'core',
    ),
    alphaConvention: option<(typeof alphaConventions)[number]>(
      'alphaConvention',
      'Alpha column holds',
      {
        alpha: 'alpha: core axis to plane',
        'core-axis-to-pole': 'core axis to pole (90° − alpha)',
      },
      'alpha',
    ),
    betaApex: option<(typeof betaApexes)[number]>(
      'betaApex',
      'Beta measured to',
      { 'down-hole': 'the down-hole apex', 'up-hole': 'the up-hole apex (+180°)' },
      'down-hole',
    ),
    referenceLine: option<typeof PROJECT_SETTING | ReferenceLine>(
      'referenceLine',
      'Beta reference line',
      { [PROJECT_SETTING]: "project's setting", bottom: 'bottom of hole', top: 'top of hole' },
      PROJECT_SETTING,
    ),
    depthUnit,
  },
  runs: { depthUnit },
  survey: {
    plungeConvention: option<PlungeConvention>(
      'plungeConvention',
      'Inclination column is',
      {
        'plunge-down': 'plunge, positive down (60 = 60° below horizontal)',
        'dip-negative-down': 'dip, negative down (−60 = 60° below horizontal)',
        'inclination-from-vertical': 'from vertical (0 = straight down, 30 = 60° below horizontal)',
      },
      'plunge-down',
    ),
    azimuthReference: option<AzimuthReference>(
      'azimuthReference',
      'Azimuths are',
      {
        magnetic: 'magnetic (declination applied per station)',
        true: 'true north',
        grid: 'grid north (convergence applied)',
      },
      'magnetic',
    ),
    depthUnit,
  },
  picks: {
    azimuthReference: option<(typeof imageAzimuthReferences)[number]>(
      'azimuthReference',
      'Image azimuths from',
      { highside: 'the high side (top of hole)', north: 'north' },
      'highside',
    ),
    northReference: option<(typeof northReferences)[number]>(
      'northReference',
      'North is',
      { magnetic: 'magnetic (corrected in the hole frame)', true: 'true north' },
      'magnetic',
    ),
    lengthUnit: option<(typeof pickLengthUnits)[number]>(
      'lengthUnit',
      'H and D in',
      { mm: 'millimetres', m: 'metres', in: 'inches' },
      'mm',
    ),
    depthUnit,
  },
} satisfies Record<CsvImportKind, Record<string, ImportOptionSpec>>

/** The same conventions as lists, in screen order (the import screen's `options`). */
export const importOptions = Object.fromEntries(
  Object.entries(importOptionSpecs).map(([kind, specs]) => [kind, Object.values(specs)]),
) as Record<CsvImportKind, ImportOptionSpec[]>

const num = (
  name: string,
  label: string,
  aliases: string[],
  required = false,
): ImportFieldSpec => ({
  name,
  label,
  kind: 'number',
  required,
  aliases,
})
const text = (
  name: string,
  label: string,
  aliases: string[],
  required = false,
): ImportFieldSpec => ({
  name,
  label,
  kind: 'text',
  required,
  aliases,
})

/**
 * The target fields of each kind, as the API names them; the server suggests a mapping by
 * matching headers to a field's name, then its aliases, in this order.
 */
export const importFieldSpecs: Record<CsvImportKind, ImportFieldSpec[]> = {
  structures: [
    num('depth', 'Depth', ['depth_m', 'md', 'from', 'depth (m)'], true),
    text('type', 'Type', ['structure', 'struct_type', 'kind', 'code'], true),
    num('alpha', 'Alpha', ['alpha_deg', 'a']),
    num('beta', 'Beta', ['beta_deg', 'b']),
    num('gamma', 'Gamma', ['gamma_deg', 'g']),
    num('dip', 'Dip (true)', ['true_dip']),
    num('dipDirection', 'Dip direction (true)', ['dip_direction', 'dipdir', 'dip_dir', 'dd']),
    text('roughness', 'Roughness I–IX', ['roughness_class', 'rough']),
    num('jrc', 'JRC', []),
    num('apertureMm', 'Aperture mm', ['aperture', 'aperture_mm']),
    text('infillType', 'Infill', ['infill', 'infill_type']),
    num('infillThicknessMm', 'Infill mm', ['infill_thickness', 'infill_mm']),
    text('persistence', 'Persistence', []),
    text('wallWeathering', 'Wall weathering', ['weathering', 'wall_weathering']),
    text('state', 'State', ['open_closed']),
    text('confidence', 'Confidence', []),
    text('comment', 'Comment', ['comments', 'remarks', 'note']),
  ],
  runs: [
    num('fromDepth', 'From', ['from', 'from_m', 'top', 'depth_from'], true),
    num('toDepth', 'To', ['to', 'to_m', 'base', 'bottom', 'depth_to'], true),
    num('recovered', 'Recovered', ['recovery', 'recovered_m', 'core_recovered', 'tcr_m'], true),
    num('solid', 'Solid core', ['solid_m', 'solid_core', 'scr_m'], true),
    num('rqdLength', 'RQD length', ['rqd_m', 'rqd_length', 'rqd'], true),
    num('fractureCount', 'Fractures', ['fractures', 'fracture_count', 'nat_fractures']),
    text('markConfidence', 'Mark confidence', ['confidence', 'orientation', 'mark', 'ori_conf']),
    text('comment', 'Comment', ['comments', 'remarks']),
  ],
  survey: [
    num('depth', 'Depth', ['md', 'depth_m', 'station'], true),
    num('azimuth', 'Azimuth', ['azi', 'az', 'bearing'], true),
    num('plunge', 'Inclination', ['dip', 'inclination', 'incl', 'inc'], true),
    text('method', 'Method', ['tool', 'instrument']),
    text('surveyedOn', 'Surveyed on', ['date', 'survey_date']),
  ],
  picks: [
    num('depth', 'Depth', ['md', 'depth_m'], true),
    text('type', 'Type', ['pick_type', 'feature', 'class']),
    num('amplitude', 'Sinusoid height H', ['height', 'h', 'amp']),
    num('diameter', 'Hole diameter D', ['d', 'caliper', 'bit_size']),
    num('troughAzimuth', 'Trough azimuth', ['trough', 'trough_azimuth', 'azimuth']),
    num('relativeDip', 'Dip relative to hole', ['rel_dip', 'relative_dip', 'apparent_dip']),
    num('relativeDipDirection', 'Relative dip direction', [
      'rel_dip_dir',
      'relative_dip_direction',
      'rel_azimuth',
    ]),
    text('quality', 'Quality', ['confidence', 'qual']),
    text('comment', 'Comment', ['comments', 'remarks']),
  ],
}
