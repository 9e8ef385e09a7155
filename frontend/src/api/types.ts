// Request and response shapes of the JSON API, mirrored by hand from the contract.
// Dates are ISO strings on the wire; ids are integers.

export type Id = number
/** An id as it appears in a URL path: route params arrive as strings. */
export type IdParam = Id | string

export const projectRoles = ['viewer', 'logger', 'engineer', 'lead'] as const
export type ProjectRole = (typeof projectRoles)[number]

export const holeStatuses = ['planned', 'drilling', 'complete', 'abandoned'] as const
export type HoleStatus = (typeof holeStatuses)[number]

export const azimuthReferences = ['magnetic', 'true', 'grid'] as const
export type AzimuthReference = (typeof azimuthReferences)[number]

export type DeclinationMode = 'auto' | 'manual'
/** Grid convergence from the CRS at each collar, or one value typed by hand. */
export type ConvergenceMode = 'auto' | 'manual'
export type ReferenceLine = 'bottom' | 'top'
export type NetProjection = 'equal-area' | 'equal-angle'

export interface ErrorDetail {
  path: string
  message: string
}

export interface ErrorBody {
  error: { code: string; message: string; details?: ErrorDetail[] }
}

export interface User {
  id: Id
  email: string
  name: string
  isAdmin: boolean
}

export interface Membership {
  projectId: Id
  projectCode: string
  projectName: string
  role: ProjectRole
}

export interface Me {
  user: User
  memberships: Membership[]
}

export interface LoginResult extends Me {
  csrfToken: string
}

export interface Project {
  id: Id
  code: string
  name: string
  crsEpsg: number
  declinationMode: DeclinationMode
  declinationDeg: number
  /** The server always sends it; optional so fixtures written before it stay valid. */
  convergenceMode?: ConvergenceMode
  /** Degrees, grid azimuth = true azimuth − convergence; used when the mode is manual. */
  gridConvergenceDeg: number
  /** The convergence each hole gets (sent with the project by GET and PATCH). */
  collarConvergence?: CollarConvergence[]
  referenceLine: ReferenceLine
  steepThresholdDeg: number
  netProjection: NetProjection
  /** Four eyes: an interval's approver must not be its checker (the server always sends it). */
  fourEyes?: boolean
  version: number
  createdAt: string
  updatedAt: string
}

export interface CollarConvergence {
  holeId: Id
  name: string
  convergenceDeg: number
  /** From the CRS at the collar, the manual value, or the manual value for want of a known CRS. */
  source: 'crs' | 'manual' | 'manual-fallback'
}

export interface ProjectWithRole extends Project {
  role: ProjectRole
}

export interface ProjectCreate {
  code: string
  name: string
  crsEpsg: number
  leadUserId: Id
  declinationMode?: DeclinationMode
  declinationDeg?: number
  referenceLine?: ReferenceLine
  steepThresholdDeg?: number
}

export type ProjectSettings = Pick<
  Project,
  | 'name'
  | 'crsEpsg'
  | 'declinationMode'
  | 'declinationDeg'
  | 'convergenceMode'
  | 'gridConvergenceDeg'
  | 'referenceLine'
  | 'steepThresholdDeg'
  | 'netProjection'
  | 'fourEyes'
>

export type ProjectUpdate = { version: number } & Partial<ProjectSettings>

export interface Member {
  userId: Id
  email: string
  name: string
  role: ProjectRole
}

export interface Hole {
  id: Id
  projectId: Id
  name: string
  collarEast: number
  collarNorth: number
  collarElevation: number
  plannedAzimuth: number
  plannedPlunge: number
  finalDepth: number
  coreSize: string
  startDate: string | null
  status: HoleStatus
  surveyRevision: number
  version: number
}

export type HoleFields = Omit<Hole, 'id' | 'projectId' | 'surveyRevision' | 'version'>
export type HoleUpdate = { version: number } & Partial<HoleFields>

export interface Station {
  id: Id
  holeId: Id
  depth: number
  /** True-north azimuth after correction. */
  azimuth: number
  /** Degrees below horizontal, positive down. */
  plunge: number
  azimuthReference: AzimuthReference
  azimuthEntered: number
  declinationApplied: number
  /** Grid convergence applied (grid-referenced stations; 0 otherwise). Always sent by the server. */
  convergenceApplied?: number
  method: string
  version: number
}

export interface StationInput {
  depth: number
  /** The azimuth as read, in the frame named by azimuthReference. */
  azimuth: number
  plunge: number
  azimuthReference: AzimuthReference
  method?: string
}

export interface AdminUser {
  id: Id
  email: string
  name: string
  isAdmin: boolean
  disabled: boolean
  version: number
}

export interface UserCreate {
  email: string
  name: string
  password: string
  isAdmin?: boolean
}

export interface UserUpdate {
  version: number
  name?: string
  isAdmin?: boolean
  disabled?: boolean
}

// ---- Logging: core runs, structures and CSV imports of a hole ----

export type MarkConfidence = 'good' | 'fair' | 'poor' | 'none'
export type RqdClassName = 'very poor' | 'poor' | 'fair' | 'good' | 'excellent'

/** The project's conventions the entry grid computes with (the API sends them with the project). */
export type LoggingProject = ProjectWithRole & { betaJumpDeg?: number }

export interface RunMetricsView {
  tcr: number
  scr: number
  rqd: number
  frequency: number
  rqdClass: RqdClassName
  flags: string[]
}

export interface RunInput {
  fromDepth: number
  toDepth: number
  recovered: number
  solid: number
  rqdLength: number
  fractureCount: number
  markConfidence: MarkConfidence
  comment: string
}

export interface Run extends RunInput {
  id: Id
  holeId: Id
  version: number
  metrics: RunMetricsView | null
}

export type RunUpdate = { version: number } & Partial<RunInput>

export type StructureSource = 'core' | 'image' | 'true'
export type StructureState = 'open' | 'closed' | 'healed'
export type Confidence = 'high' | 'medium' | 'low'

/** What a logger enters for a structure; condition attributes after ISRM (1978). */
export interface StructureInput {
  depth: number
  type: string
  source?: 'core' | 'true'
  alpha?: number
  beta?: number
  gamma?: number
  dip?: number
  dipDirection?: number
  referenceLine?: ReferenceLine
  roughness?: string
  jrc?: number
  apertureMm?: number
  infillType?: string
  infillThicknessMm?: number
  persistence?: string
  wallWeathering?: string
  state?: StructureState
  confidence?: Confidence
  comment?: string
}

export type StructureUpdate = { version: number } & Partial<StructureInput>

/** A stored structure: inputs, the server's computed orientation and flags, condition. */
export interface Structure {
  id: Id
  holeId: Id
  depth: number
  type: string
  source: StructureSource
  alpha: number | null
  beta: number | null
  gamma: number | null
  referenceLine: ReferenceLine | null
  inputDip: number | null
  inputDipDirection: number | null
  /** Image picks: the sinusoid as picked (trough azimuth referred to true north when north-referenced). */
  pickAmplitude: number | null
  pickDiameter: number | null
  pickTroughAzimuth: number | null
  pickReference: string | null
  pickQuality: string | null
  dip: number | null
  dipDirection: number | null
  poleTrend: number | null
  polePlunge: number | null
  holeTrend: number | null
  holePlunge: number | null
  east: number | null
  north: number | null
  elevation: number | null
  terzaghiWeight: number | null
  declinationApplied: number | null
  surveyRevision: number | null
  flags: string[]
  roughness: string | null
  jrc: number | null
  apertureMm: number | null
  infillType: string | null
  infillThicknessMm: number | null
  persistence: string | null
  wallWeathering: string | null
  state: StructureState | null
  confidence: Confidence | null
  comment: string
  version: number
  createdBy: Id | null
  updatedBy: Id | null
  createdAt: string
  updatedAt: string
}

export const csvImportKinds = ['structures', 'runs', 'survey', 'picks'] as const
export type CsvImportKind = (typeof csvImportKinds)[number]
export type ImportStatus = 'previewed' | 'queued' | 'committing' | 'committed' | 'failed' | 'undone'

/** One row of a clean preview; structures carry the orientation computed with the hole's survey. */
export type ImportSampleRow = Record<string, unknown> & {
  line: number
  computed?: { dip: number | null; dipDirection: number | null; flags: string[] }
}

export interface ImportPreview {
  importId: string
  kind: CsvImportKind
  fileName: string
  headers: string[]
  mapping: Record<string, string>
  options: Record<string, unknown>
  rowCount: number
  /** More rows than the server commits within a request: the commit runs as a job. */
  background: boolean
  sample: ImportSampleRow[]
  flagCounts: Record<string, number>
  /** A committed import of the same bytes into this hole: committing again needs a confirmation. */
  duplicateOf: { importId: string; fileName: string; committedAt: string | null } | null
  /** Reviewed intervals the rows reach: approved ones refuse the commit, checked ones go to draft. */
  intervalsReached: {
    id: Id
    name: string
    fromDepth: number
    toDepth: number
    status: 'checked' | 'approved' | 'issued'
  }[]
}

export interface ImportRecord {
  id: string
  kind: string
  status: ImportStatus
  fileName: string
  rowCount: number
  progress: number
  message: string
  createdAt: string
  committedAt: string | null
  undoneAt: string | null
  /** Rows a replacing import (runs, survey) took out, put back if it is undone. */
  replacedCount: number
}

export interface ImportUndone extends ImportRecord {
  removed: number
  restored: number
  recomputed: number
}
