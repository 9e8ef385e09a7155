import { api, seg } from './client'

export interface AgsFinding {
  line: number
  /** The AGS4 rule as the rules number it: "7", "10b", "19a"… */
  rule: string
  severity: 'error' | 'warning'
  message: string
}

/** What the built-in groups could not settle (no dictionary of the edition loaded). */
export interface AgsUnchecked {
  rule: string
  group: string
  line: number
  message: string
}

export interface AgsFileCheck {
  fileName: string
  bytes: number
  edition: string | null
  /** loaded: the declared edition's standard dictionary; built-in: the groups Downdip writes. */
  dictionary: { edition: string; source: 'loaded' | 'built-in' }
  errors: number
  warnings: number
  byRule: { rule: string; errors: number; warnings: number }[]
  findings: AgsFinding[]
  /** More findings than were sent: the counts per rule still cover the whole file. */
  truncated: boolean
  unchecked: AgsUnchecked[]
  notes: string[]
  groups: { name: string; line: number; rows: number }[]
}

/** A standard dictionary an administrator loaded, one per edition. */
export interface AgsDictionary {
  edition: string
  fileName: string
  fileSize: number
  sha256: string
  groupCount: number
  headingCount: number
  loadedAt: string
  loadedBy: number | null
  loadedByName: string | null
}

/** Checks any AGS4 file against the AGS4 rules and standard dictionary; nothing is stored. */
export function checkAgsFile(file: File): Promise<AgsFileCheck> {
  const form = new FormData()
  form.append('file', file)
  return api.upload<AgsFileCheck>('/ags/validate', form)
}

export const listAgsDictionaries = () => api.get<AgsDictionary[]>('/ags/dictionaries')

/** Loads (or replaces) an edition's dictionary; `edition` only where the file's TRAN_AGS lacks it. */
export function loadAgsDictionary(file: File, edition?: string): Promise<AgsDictionary> {
  const form = new FormData()
  if (edition) form.append('edition', edition)
  form.append('file', file)
  return api.upload<AgsDictionary>('/ags/dictionaries', form)
}

export const removeAgsDictionary = (edition: string) =>
  api.delete<void>(`/ags/dictionaries/${seg(edition)}`)
