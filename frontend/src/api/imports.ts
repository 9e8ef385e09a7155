import { api, seg } from './client'
import type { CsvImportKind, IdParam, ImportPreview, ImportRecord, ImportUndone } from './types'

const importsPath = (projectId: IdParam, holeId: IdParam) =>
  `/projects/${seg(projectId)}/holes/${seg(holeId)}/imports`

export interface ImportUpload {
  file: File
  kind: CsvImportKind
  /** Field → column header; omitted on the first upload so the server suggests one. */
  mapping?: Record<string, string>
  options: Record<string, unknown>
}

/** Uploads a CSV for checking: a clean file answers with a preview, nothing is stored before commit. */
export function uploadImport(projectId: IdParam, holeId: IdParam, upload: ImportUpload) {
  const form = new FormData()
  form.append('kind', upload.kind)
  if (upload.mapping) form.append('mapping', JSON.stringify(upload.mapping))
  form.append('options', JSON.stringify(upload.options))
  form.append('file', upload.file, upload.file.name)
  return api.upload<ImportPreview>(importsPath(projectId, holeId), form)
}

/**
 * 200 with status committed, or 202 with status queued when the server runs it as a job. The same
 * file committed to the hole before answers 409 `duplicate_import` unless `confirmDuplicate`.
 */
export const commitImport = (
  projectId: IdParam,
  holeId: IdParam,
  importId: string,
  confirmDuplicate = false,
) =>
  api.post<ImportRecord>(
    `${importsPath(projectId, holeId)}/${seg(importId)}/commit`,
    confirmDuplicate ? { confirmDuplicate: true } : {},
  )

/** Removes what a committed import added (and puts back what it replaced), in one transaction. */
export const undoImport = (projectId: IdParam, holeId: IdParam, importId: string) =>
  api.post<ImportUndone>(`${importsPath(projectId, holeId)}/${seg(importId)}/undo`)

export const getImport = (projectId: IdParam, holeId: IdParam, importId: string) =>
  api.get<ImportRecord>(`${importsPath(projectId, holeId)}/${seg(importId)}`)

export const listImports = (projectId: IdParam, holeId: IdParam) =>
  api.get<ImportRecord[]>(importsPath(projectId, holeId))
