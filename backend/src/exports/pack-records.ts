import { and, desc, eq, sql } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import { packFiles, packs, users } from '../../../schema/index'
import type { Db } from '../db/client'
import { notFound } from '../http/errors'

const creator = alias(users, 'creator')
const issuer = alias(users, 'issuer')
const summary = {
  id: packs.id,
  projectId: packs.projectId,
  status: packs.status,
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

/** One pack with its file list (name, mime, size, sha256). */
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
  return { ...row, files }
}
