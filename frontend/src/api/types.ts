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
  gridConvergenceDeg: number
  referenceLine: ReferenceLine
  steepThresholdDeg: number
  netProjection: NetProjection
  version: number
  createdAt: string
  updatedAt: string
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
  | 'gridConvergenceDeg'
  | 'referenceLine'
  | 'steepThresholdDeg'
  | 'netProjection'
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
