import { expect } from 'vitest'
import { readFileSync } from 'node:fs'
import { countRows, type Client, type Fixture } from './fixture'

/** Shared by the import tests: upload, commit and undo through the API of the fixture's hole. */
export const importsUrl = (fx: Fixture, holeId = fx.holeId) =>
  `/api/projects/${fx.projectId}/holes/${holeId}/imports`

export const testdata = (name: string) =>
  readFileSync(new URL(`../../testdata/csv/${name}`, import.meta.url))

export function upload(
  fx: Fixture,
  client: Client,
  kind: string,
  file: Buffer,
  name: string,
  extra: Record<string, string> = {},
) {
  const req = client.postMultipart(importsUrl(fx)).field('kind', kind)
  for (const [k, v] of Object.entries(extra)) req.field(k, v)
  return req.attach('file', file, name)
}

/** Uploads and commits; returns the import id. */
export async function importFile(
  fx: Fixture,
  client: Client,
  kind: string,
  file: Buffer,
  name: string,
) {
  const preview = await upload(fx, client, kind, file, name)
  expect(preview.status, JSON.stringify(preview.body)).toBe(201)
  const id = preview.body.data.importId as string
  const commit = await client.post(`${importsUrl(fx)}/${id}/commit`)
  expect(commit.status, JSON.stringify(commit.body)).toBe(200)
  return id
}

const written = ['structures', 'imports', 'core_runs', 'survey_stations', 'audit_events']

/** Runs `action` and proves it wrote nothing to the tables an import touches. */
export async function nothingWritten<T>(fx: Fixture, action: () => Promise<T>): Promise<T> {
  const before = await Promise.all(written.map((t) => countRows(fx.db, t)))
  const result = await action()
  expect(await Promise.all(written.map((t) => countRows(fx.db, t)))).toEqual(before)
  return result
}
