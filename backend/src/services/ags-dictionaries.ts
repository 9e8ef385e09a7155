import { asc, eq, sql } from 'drizzle-orm'
import { agsDictionaries, agsDictionaryGroups, users } from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { sha256Hex } from '../exports/hash'
import { decodeAgsBytes } from '../exports/ags4-bytes'
import {
  DictionaryFileError,
  isEditionForm,
  readDictionaryFile,
  type DictionaryFile,
} from '../exports/ags4-dictionary-file'
import { dictionaryOf, type StandardDictionary } from '../exports/ags4-standard'
import { badRequest, notFound, type ErrorDetail } from '../http/errors'
import { audit } from './audit'

const listColumns = {
  edition: agsDictionaries.edition,
  fileName: agsDictionaries.fileName,
  fileSize: agsDictionaries.fileSize,
  sha256: agsDictionaries.sha256,
  groupCount: agsDictionaries.groupCount,
  headingCount: agsDictionaries.headingCount,
  loadedAt: agsDictionaries.loadedAt,
  loadedBy: agsDictionaries.loadedBy,
  loadedByName: users.name,
}

/** The loaded dictionaries (or one edition's), newest edition first: when, by whom, from what. */
export function listDictionaries(db: Executor, edition?: string) {
  return db
    .select(listColumns)
    .from(agsDictionaries)
    .leftJoin(users, eq(users.id, agsDictionaries.loadedBy))
    .where(edition ? eq(agsDictionaries.edition, edition) : undefined)
    .orderBy(sql`string_to_array(${agsDictionaries.edition}, '.')::int[] desc`)
}

/** Reads the upload or answers 400 naming each refused line as `file.line.N.HEADING`. */
function readOrRefuse(bytes: Buffer): DictionaryFile {
  try {
    return readDictionaryFile(decodeAgsBytes(bytes).text)
  } catch (err: unknown) {
    if (!(err instanceof DictionaryFileError)) throw err
    const details: ErrorDetail[] = err.problems.map((p) => ({
      path: ['file', ...(p.line ? ['line', p.line] : []), ...(p.field ? [p.field] : [])].join('.'),
      message: p.message,
    }))
    throw badRequest(
      `The file is not an AGS4 standard dictionary: ${err.message}`,
      details,
      'invalid_file',
    )
  }
}

/** The edition: the file's TRAN_AGS, or the upload's `edition` field; both, they must agree. */
function editionOf(file: DictionaryFile, given: string | undefined): string {
  const declared = file.edition
  if (declared && !isEditionForm(declared.value)) {
    const message = `TRAN_AGS "${declared.value}" is not an AGS4 edition such as 4.1.1`
    throw badRequest(message, [{ path: `file.line.${declared.line}.TRAN_AGS`, message }])
  }
  if (declared && given && declared.value !== given) {
    const message = `the file's TRAN_AGS (line ${declared.line}) says ${declared.value}`
    throw badRequest(`The edition given is not the file's: ${message}.`, [
      { path: 'body.edition', message },
    ])
  }
  const edition = declared?.value ?? given
  if (!edition) {
    const message = 'the file has no TRAN_AGS: give the edition'
    throw badRequest('Which edition is this dictionary? The file does not say.', [
      { path: 'body.edition', message },
    ])
  }
  return edition
}

/**
 * Loads an edition's standard dictionary from its AGS4 file, replacing one loaded before for the
 * same edition: the definitions, the file's name, size and SHA-256, and an audit event, all in one
 * transaction (a lock per edition keeps two uploads of one edition from interleaving).
 */
export async function loadDictionary(
  db: Db,
  actorId: number,
  upload: { fileName: string; bytes: Buffer },
  given: { edition?: string },
) {
  const file = readOrRefuse(upload.bytes)
  const edition = editionOf(file, given.edition)
  const replaced = await db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`ags-dictionary:${edition}`}))`)
    const [before] = await tx
      .select()
      .from(agsDictionaries)
      .where(eq(agsDictionaries.edition, edition))
    if (before) await tx.delete(agsDictionaries).where(eq(agsDictionaries.edition, edition))
    const [after] = await tx
      .insert(agsDictionaries)
      .values({
        edition,
        fileName: upload.fileName,
        fileSize: upload.bytes.length,
        sha256: sha256Hex(upload.bytes),
        groupCount: file.groups.length,
        headingCount: file.headingCount,
        loadedBy: actorId,
      })
      .returning()
    await tx.insert(agsDictionaryGroups).values(
      file.groups.map((g, position) => ({
        edition,
        name: g.name,
        position,
        parent: g.parent ?? null,
        title: g.title ?? '',
        headings: g.headings,
      })),
    )
    await audit(tx, {
      projectId: null,
      userId: actorId,
      entity: 'ags-dictionary',
      entityId: edition,
      action: before ? 'replace' : 'create',
      before: before ?? null,
      after,
    })
    return !!before
  })
  const [row] = await listDictionaries(db, edition)
  return { row, replaced }
}

/** Removes an edition's dictionary (404 if none is loaded); files of it fall back to built-in. */
export async function removeDictionary(db: Db, actorId: number, edition: string) {
  await db.transaction(async (tx) => {
    const [before] = await tx
      .delete(agsDictionaries)
      .where(eq(agsDictionaries.edition, edition))
      .returning()
    if (!before) throw notFound(`A loaded AGS ${edition} dictionary`)
    await audit(tx, {
      projectId: null,
      userId: actorId,
      entity: 'ags-dictionary',
      entityId: edition,
      action: 'delete',
      before,
    })
  })
}

/** The loaded dictionary of an edition, or undefined when none is loaded. */
export async function loadedDictionary(
  db: Executor,
  edition: string | null,
): Promise<StandardDictionary | undefined> {
  if (!edition || !isEditionForm(edition)) return undefined
  const rows = await db
    .select()
    .from(agsDictionaryGroups)
    .where(eq(agsDictionaryGroups.edition, edition))
    .orderBy(asc(agsDictionaryGroups.position))
  if (!rows.length) return undefined
  return dictionaryOf(
    edition,
    'loaded',
    rows.map((r) => ({
      name: r.name,
      parent: r.parent ?? undefined,
      title: r.title,
      headings: r.headings,
    })),
  )
}
