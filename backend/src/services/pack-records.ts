import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import { holes, intervals, packFiles, packs, users, type ProjectRole } from '../../../schema/index'
import type { Db } from '../db/client'
import { conflict, forbidden, notFound } from '../http/errors'

const creator = alias(users, 'creator')
const issuer = alias(users, 'issuer')
const summary = {
  id: packs.id,
  projectId: packs.projectId,
  status: packs.status,
  draft: packs.draft,
  selection: packs.selection,
  progress: packs.progress,
  message: packs.message,
  inputsHash: packs.inputsHash,
  contentHash: packs.contentHash,
  createdAt: packs.createdAt,
  createdBy: packs.createdBy,
  createdByName: creator.name,
  issuedAt: packs.issuedAt,
  issuedBy: packs.issuedBy,
  issuedByName: issuer.name,
}

/** The project's packs, newest first, without file bytes. */
export function listPacks(db: Db, projectId: number) {
  return db
    .select(summary)
    .from(packs)
    .leftJoin(creator, eq(creator.id, packs.createdBy))
    .leftJoin(issuer, eq(issuer.id, packs.issuedBy))
    .where(eq(packs.projectId, projectId))
    .orderBy(desc(packs.createdAt))
}

/** One pack with its file list (name, mime, size, sha256) and its packed intervals as they are now. */
export async function getPack(db: Db, projectId: number, packId: string) {
  const [row] = await db
    .select(summary)
    .from(packs)
    .leftJoin(creator, eq(creator.id, packs.createdBy))
    .leftJoin(issuer, eq(issuer.id, packs.issuedBy))
    .where(and(eq(packs.projectId, projectId), eq(packs.id, packId)))
  if (!row) throw notFound('Pack')
  const files = await db
    .select({
      name: packFiles.name,
      mime: packFiles.mime,
      sha256: packFiles.sha256,
      size: sql<number>`octet_length(${packFiles.bytes})`.mapWith(Number),
    })
    .from(packFiles)
    .where(eq(packFiles.packId, packId))
    .orderBy(packFiles.name)
  const packed = (row.selection as { packed?: { intervalIds?: number[] } }).packed?.intervalIds
  const packedIntervals = packed?.length
    ? await db
        .select({
          id: intervals.id,
          holeId: intervals.holeId,
          holeName: holes.name,
          name: intervals.name,
          status: intervals.status,
        })
        .from(intervals)
        .innerJoin(holes, eq(holes.id, intervals.holeId))
        .where(inArray(intervals.id, packed))
        .orderBy(asc(holes.name), asc(intervals.fromDepth))
    : []
  return { ...row, files, intervals: packedIntervals }
}

/** A file's bytes. Viewers may read issued packs only; other members any ready or issued pack. */
export async function packFile(
  db: Db,
  projectId: number,
  role: ProjectRole,
  packId: string,
  name: string,
) {
  const [pack] = await db
    .select()
    .from(packs)
    .where(and(eq(packs.projectId, projectId), eq(packs.id, packId)))
  if (!pack) throw notFound('Pack')
  if (role === 'viewer' && pack.status !== 'issued')
    throw forbidden('Viewers can download issued packs only.')
  if (pack.status !== 'ready' && pack.status !== 'issued')
    throw conflict('The pack is not built yet.', 'pack_not_ready')
  const [file] = await db
    .select()
    .from(packFiles)
    .where(and(eq(packFiles.packId, packId), eq(packFiles.name, name)))
  if (!file) throw notFound('File')
  return file
}
