import { afterAll, beforeAll } from 'vitest'
import { readFileSync } from 'node:fs'
import { crc32 } from 'node:zlib'
import { fileURLToPath } from 'node:url'
import sharp from 'sharp'
import type request from 'supertest'
import { and, asc, eq } from 'drizzle-orm'
import { imageTiles } from '../../schema/index'
import { decodeTile } from '../../backend/src/services/image-rows'
import { clientFor, countRows, createFixture, type Client, type Fixture } from './fixture'

const dir = fileURLToPath(new URL('../../testdata/images/', import.meta.url))
export const imageBytes = (name: string) => readFileSync(dir + name)

/** The image route tests' world: the fixture and signed-in logger, viewer and outsider clients. */
export function imagesSuite(env: Record<string, string> = {}) {
  const ctx = {
    fx: undefined as unknown as Fixture,
    logger: undefined as unknown as Client,
    viewer: undefined as unknown as Client,
    outsider: undefined as unknown as Client,
    url: (holeId?: number) =>
      `/api/projects/${ctx.fx.projectId}/holes/${holeId ?? ctx.fx.holeId}/images`,
  }
  beforeAll(async () => {
    ctx.fx = await createFixture(env)
    ctx.logger = await clientFor(ctx.fx.app, 'logger')
    ctx.viewer = await clientFor(ctx.fx.app, 'viewer')
    ctx.outsider = await clientFor(ctx.fx.app, 'outsider')
  })
  afterAll(() => ctx.fx.close())
  return ctx
}

/** Uploads one file with form fields (numbers as text, as a browser form sends them). */
export function uploadImage(
  client: Client,
  url: string,
  bytes: Buffer,
  name: string,
  fields: Record<string, string | number | boolean> = {},
) {
  let req = client.postMultipart(url)
  for (const [k, v] of Object.entries(fields)) req = req.field(k, String(v))
  return req.attach('file', bytes, name)
}

/** Rows of the three image tables: a refused upload must leave all three as they were. */
export const storedCounts = async (fx: Fixture) => ({
  images: await countRows(fx.db, 'images'),
  files: await countRows(fx.db, 'image_files'),
  tiles: await countRows(fx.db, 'image_tiles'),
})

/** Every stored tile of one level, inflated and joined: the level's samples, top row first. */
export async function storedLevel(fx: Fixture, imageId: number, level: number, sampleBits: number) {
  const tiles = await fx.db
    .select()
    .from(imageTiles)
    .where(and(eq(imageTiles.imageId, imageId), eq(imageTiles.level, level)))
    .orderBy(asc(imageTiles.tile))
  const parts = tiles.map((t) => decodeTile(t.bytes, sampleBits))
  const out = sampleBits === 16 ? new Uint16Array(sum(parts)) : new Uint8Array(sum(parts))
  let at = 0
  for (const p of parts) {
    out.set(p, at)
    at += p.length
  }
  return { samples: out, rows: tiles.reduce((n, t) => n + t.rows, 0), tiles }
}
const sum = (parts: ArrayLike<number>[]) => parts.reduce((n, p) => n + p.length, 0)

/**
 * The file's pixels read back with sharp on its own: grey as one 8- or 16-bit channel, colour as
 * 8-bit sRGB with any alpha dropped — what the stored level 0 must equal.
 */
export async function sharpPixels(bytes: Buffer, channels: 1 | 3, sampleBits: 8 | 16) {
  const img = sharp(bytes).flatten({ background: '#000000' })
  if (channels === 3) {
    const { data } = await img
      .toColourspace('srgb')
      .raw({ depth: 'uchar' })
      .toBuffer({ resolveWithObject: true })
    return new Uint8Array(data)
  }
  if (sampleBits === 16) {
    const { data } = await img
      .toColourspace('grey16')
      .raw({ depth: 'ushort' })
      .toBuffer({ resolveWithObject: true })
    return new Uint16Array(Uint8Array.from(data).buffer)
  }
  const { data } = await img.extractChannel(0).raw().toBuffer({ resolveWithObject: true })
  return new Uint8Array(data)
}

/** Row k of level L+1 from level L by the contract: mean of rows 2k and 2k+1 rounded half up. */
export function expectedNextRow(
  level: ArrayLike<number>,
  rowLength: number,
  rows: number,
  k: number,
) {
  const out: number[] = []
  for (let i = 0; i < rowLength; i++) {
    const a = level[2 * k * rowLength + i]
    out.push(2 * k + 1 < rows ? Math.floor((a + level[(2 * k + 1) * rowLength + i] + 1) / 2) : a)
  }
  return out
}

type Parser = Parameters<request.Test['parse']>[0]
/** Keeps a response body as bytes (superagent has already inflated a deflate one). */
export const binary = ((
  res: NodeJS.ReadableStream,
  done: (err: Error | null, body: Buffer) => void,
) => {
  const parts: Buffer[] = []
  res.on('data', (c: Buffer) => parts.push(c))
  res.on('end', () => done(null, Buffer.concat(parts)))
}) as unknown as Parser

/** A PNG whose chunks are whole (CRC fixed up) but whose compressed pixels are garbage. */
export function damagedBody(png: Buffer): Buffer {
  const out = Buffer.from(png)
  const idats: { at: number; length: number }[] = []
  for (let at = 8; at < out.length; at += 12 + out.readUInt32BE(at))
    if (out.toString('latin1', at + 4, at + 8) === 'IDAT')
      idats.push({ at, length: out.readUInt32BE(at) })
  const mid = idats[idats.length >> 1]
  const from = mid.at + 8 + Math.min(100, mid.length >> 2)
  out.fill(0xff, from, from + Math.min(64, mid.length >> 1))
  out.writeUInt32BE(
    crc32(out.subarray(mid.at + 4, mid.at + 8 + mid.length)),
    mid.at + 8 + mid.length,
  )
  return out
}
