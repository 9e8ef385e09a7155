// Request and response shapes of the JSON API, derived from the tables and request schemas in
// schema/ and from orient/: type-only imports, so no drizzle reaches the browser. What the server
// adds to a row is declared beside it. Dates are ISO strings on the wire; ids are integers.
import type { RunMetrics } from '../../../orient/index'
import type {
  CoreRun as CoreRunRow,
  Hole as HoleRow,
  HoleCreate,
  Pack as PackRow,
  Project as ProjectRow,
  RunInputT,
  Structure as StructureRow,
  StructureSent,
  StructureUpdate as StructureUpdateBody,
  SurveyStation,
  User as UserRow,
} from '../../../schema/index'
import type { Confidence, ProjectRole, StructureState } from '../../../schema/vocabulary'

export { projectRoles } from '../../../schema/vocabulary'
export type {
  AzimuthReference,
  CsvImportKind,
  HoleStatus,
  MarkConfidence,
  ProjectRole,
} from '../../../schema/vocabulary'
export type {
  HoleUpdate,
  ProjectCreate,
  ProjectUpdate,
  RunUpdate,
  StationInputT as StationInput,
  UserCreate,
  UserUpdate,
} from '../../../schema/index'
export type { ImportPreview, ImportRecord, ImportSampleRow, ImportUndone } from './import-types'

export type Id = number
/** An id as it appears in a URL path: route params arrive as strings. */
export type IdParam = Id | string

/** A value as JSON carries it: a Date becomes its ISO string (a null stays null). */
type WireValue<V> = V extends Date ? string : V
/** A row as the API sends it. */
export type Wire<T> = { [K in keyof T]: WireValue<T[K]> }

export interface ErrorDetail {
  path: string
  message: string
}

export interface ErrorBody {
  error: { code: string; message: string; details?: ErrorDetail[] }
}

export type User = Pick<UserRow, 'id' | 'email' | 'name' | 'isAdmin'>
export type AdminUser = Pick<UserRow, 'id' | 'email' | 'name' | 'isAdmin' | 'disabled' | 'version'>

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

/** A live project (deleted ones are only in the bin), with the convergence GET and PATCH add. */
export type Project = Wire<Omit<ProjectRow, 'deletedAt' | 'deletedBy'>> & {
  collarConvergence?: CollarConvergence[]
}

export interface CollarConvergence {
  holeId: Id
  name: string
  convergenceDeg: number
  /** From the CRS at the collar, the manual value, or the manual value for want of a known CRS. */
  source: 'crs' | 'manual' | 'manual-fallback'
}

export type ProjectWithRole = Project & { role: ProjectRole }
/** The project's conventions the entry grid computes with. */
export type LoggingProject = ProjectWithRole

/** What the settings editor edits. */
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

export type Member = Pick<User, 'email' | 'name'> & { userId: Id; role: ProjectRole }

export type Hole = Wire<Omit<HoleRow, 'deletedAt' | 'deletedBy'>>
/** The fields a hole is created with, all given (the hole dialog edits each). */
export type HoleFields = Pick<Hole, keyof HoleCreate>

export type Station = Wire<SurveyStation>

// ---- Logging: core runs and structures of a hole (CSV imports: import-types.ts) ----

export type RunInput = RunInputT
export type Run = Wire<CoreRunRow> & {
  metrics: RunMetrics | null
  /** Orientation-line rotation in force (degrees added to the logged betas); lists carry it. */
  betaRotation?: number
}

/**
 * What a logger enters for a structure; condition attributes after ISRM (1978). The type is kept
 * as typed while the row is drafted (the preview computes without it); the server takes its words.
 */
export type StructureInput = Omit<StructureSent, 'type'> & { type: string }
export type StructureUpdate = Omit<StructureUpdateBody, 'type'> & { type?: string }
/**
 * A stored structure: inputs, the server's computed orientation and flags, condition. State and
 * confidence are text columns that the API only fills with their words.
 */
export type Structure = Omit<Wire<StructureRow>, 'state' | 'confidence'> & {
  state: StructureState | null
  confidence: Confidence | null
}

/** A design pack as listed (its build lease stays on the server). */
export type Pack = Wire<Omit<PackRow, 'attempt' | 'leaseUntil'>>
