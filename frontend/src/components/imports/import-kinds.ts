// What each CSV import kind maps and asks: target fields (mapping keys, as the API names them), the
// conventions of the file, and what a commit does to the hole.
import type { CsvImportKind } from '../../api/types'

export interface ImportField {
  name: string
  label: string
  required?: boolean
}

export interface ImportOption {
  key: string
  label: string
  choices: { value: string; label: string }[]
  initial: string
}

export interface ImportKindSpec {
  title: string
  fields: ImportField[]
  options: ImportOption[]
  /** Said before commit: structures are added, runs and survey replaced. */
  commitNote: string
}

/** An option left to the project's setting: the key is not sent. */
export const PROJECT_SETTING = 'project'
/** A field with no column of the file (a select cannot show an empty value as chosen). */
export const NOT_MAPPED = '(none)'

const depthUnit: ImportOption = {
  key: 'depthUnit',
  label: 'Depths in',
  choices: [
    { value: 'm', label: 'metres' },
    { value: 'ft', label: 'feet (converted to metres)' },
  ],
  initial: 'm',
}

export const importKinds = {
  structures: {
    title: 'structures',
    fields: [
      { name: 'depth', label: 'Depth', required: true },
      { name: 'type', label: 'Type', required: true },
      { name: 'alpha', label: 'Alpha' },
      { name: 'beta', label: 'Beta' },
      { name: 'gamma', label: 'Gamma' },
      { name: 'dip', label: 'Dip (true)' },
      { name: 'dipDirection', label: 'Dip direction (true)' },
      { name: 'roughness', label: 'Roughness I–IX' },
      { name: 'jrc', label: 'JRC' },
      { name: 'apertureMm', label: 'Aperture mm' },
      { name: 'infillType', label: 'Infill' },
      { name: 'infillThicknessMm', label: 'Infill mm' },
      { name: 'persistence', label: 'Persistence' },
      { name: 'wallWeathering', label: 'Wall weathering' },
      { name: 'state', label: 'State' },
      { name: 'confidence', label: 'Confidence' },
      { name: 'comment', label: 'Comment' },
    ],
    options: [
      {
        key: 'mode',
        label: 'Orientation given as',
        choices: [
          { value: 'core', label: 'core angles α, β' },
          { value: 'true', label: 'true dip, dip direction' },
        ],
        initial: 'core',
      },
      {
        key: 'alphaConvention',
        label: 'Alpha column holds',
        choices: [
          { value: 'alpha', label: 'alpha: core axis to plane' },
          { value: 'core-axis-to-pole', label: 'core axis to pole (90° − alpha)' },
        ],
        initial: 'alpha',
      },
      {
        key: 'betaApex',
        label: 'Beta measured to',
        choices: [
          { value: 'down-hole', label: 'the down-hole apex' },
          { value: 'up-hole', label: 'the up-hole apex (+180°)' },
        ],
        initial: 'down-hole',
      },
      {
        key: 'referenceLine',
        label: 'Beta reference line',
        choices: [
          { value: PROJECT_SETTING, label: "project's setting" },
          { value: 'bottom', label: 'bottom of hole' },
          { value: 'top', label: 'top of hole' },
        ],
        initial: PROJECT_SETTING,
      },
      depthUnit,
    ],
    commitNote: "Committing adds these structures to the hole's logged structures.",
  },
  runs: {
    title: 'core runs',
    fields: [
      { name: 'fromDepth', label: 'From', required: true },
      { name: 'toDepth', label: 'To', required: true },
      { name: 'recovered', label: 'Recovered', required: true },
      { name: 'solid', label: 'Solid core', required: true },
      { name: 'rqdLength', label: 'RQD length', required: true },
      { name: 'fractureCount', label: 'Fractures' },
      { name: 'markConfidence', label: 'Mark confidence' },
      { name: 'comment', label: 'Comment' },
    ],
    options: [depthUnit],
    commitNote:
      "Committing REPLACES all of this hole's core runs with the rows of this file, and recomputes every structure's flags.",
  },
  survey: {
    title: 'survey stations',
    fields: [
      { name: 'depth', label: 'Depth', required: true },
      { name: 'azimuth', label: 'Azimuth', required: true },
      { name: 'plunge', label: 'Inclination', required: true },
      { name: 'method', label: 'Method' },
      { name: 'surveyedOn', label: 'Surveyed on' },
    ],
    options: [
      {
        key: 'plungeConvention',
        label: 'Inclination column is',
        choices: [
          { value: 'plunge-down', label: 'plunge, positive down (60 = 60° below horizontal)' },
          { value: 'dip-negative-down', label: 'dip, negative down (−60 = 60° below horizontal)' },
          {
            value: 'inclination-from-vertical',
            label: 'from vertical (0 = straight down, 30 = 60° below horizontal)',
          },
        ],
        initial: 'plunge-down',
      },
      {
        key: 'azimuthReference',
        label: 'Azimuths are',
        choices: [
          { value: 'magnetic', label: 'magnetic (declination applied per station)' },
          { value: 'true', label: 'true north' },
          { value: 'grid', label: 'grid north (convergence applied)' },
        ],
        initial: 'magnetic',
      },
      depthUnit,
    ],
    commitNote:
      "Committing REPLACES this hole's whole survey with the stations of this file; every structure is then recomputed with it.",
  },
} as Record<CsvImportKind, ImportKindSpec>

importKinds.picks = {
  title: 'televiewer picks',
  fields: [
    { name: 'depth', label: 'Depth', required: true },
    { name: 'type', label: 'Type' },
    { name: 'amplitude', label: 'Sinusoid height H' },
    { name: 'diameter', label: 'Hole diameter D' },
    { name: 'troughAzimuth', label: 'Trough azimuth' },
    { name: 'relativeDip', label: 'Dip relative to hole' },
    { name: 'relativeDipDirection', label: 'Relative dip direction' },
    { name: 'quality', label: 'Quality' },
    { name: 'comment', label: 'Comment' },
  ],
  options: [
    {
      key: 'azimuthReference',
      label: 'Image azimuths from',
      choices: [
        { value: 'highside', label: 'the high side (top of hole)' },
        { value: 'north', label: 'north' },
      ],
      initial: 'highside',
    },
    {
      key: 'northReference',
      label: 'North is',
      choices: [
        { value: 'magnetic', label: 'magnetic (corrected in the hole frame)' },
        { value: 'true', label: 'true north' },
      ],
      initial: 'magnetic',
    },
    {
      key: 'lengthUnit',
      label: 'H and D in',
      choices: [
        { value: 'mm', label: 'millimetres' },
        { value: 'm', label: 'metres' },
        { value: 'in', label: 'inches' },
      ],
      initial: 'mm',
    },
    depthUnit,
  ],
  commitNote:
    'Committing adds these picks as image structures, converted with the survey at each depth; picks in steep parts or taller than the hole allows are flagged.',
}

/** The options to send: those left to the project's setting are left out. */
export function optionsToSend(values: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(values).filter(([, v]) => v !== PROJECT_SETTING))
}

export function initialOptions(kind: CsvImportKind): Record<string, string> {
  return Object.fromEntries(importKinds[kind].options.map((o) => [o.key, o.initial]))
}

/** An import's status in words, the same in the import panel and the history. */
export const importStatusWords: Record<string, string> = {
  previewed: 'checked, not committed',
  queued: 'waiting for a worker',
  committing: 'committing',
  committed: 'committed',
  failed: 'failed',
  undone: 'undone',
}
