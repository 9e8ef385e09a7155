import { Readable } from 'node:stream'
import { pipeline } from 'node:stream/promises'
import type { PoolClient } from 'pg'
import { from as copyFrom } from 'pg-copy-streams'
import { structures, type StructureInputT } from '../../../schema/index'
import type { StructureComputed } from '../../../orient/index'
import {
  computedKeys,
  computedValues,
  type ComputedKey,
  type StructureInputRow,
} from '../db/structure-columns'

/** The input and provenance columns COPY writes; the computed ones follow; the rest take defaults. */
const inputKeys = [
  'holeId',
  'depth',
  'type',
  'source',
  'alpha',
  'beta',
  'gamma',
  'referenceLine',
  'inputDip',
  'inputDipDirection',
  'roughness',
  'jrc',
  'apertureMm',
  'infillType',
  'infillThicknessMm',
  'persistence',
  'wallWeathering',
  'state',
  'confidence',
  'comment',
  'importId',
  'createdBy',
  'updatedBy',
] as const satisfies readonly (keyof StructureInputRow)[]
type CopyKey = (typeof inputKeys)[number] | ComputedKey
const copyKeys: readonly CopyKey[] = [...inputKeys, ...computedKeys]

/** One value in COPY text format: \N for null, backslash escapes for tab, newline and backslash. */
function field(v: unknown): string {
  if (v === null || v === undefined) return '\\N'
  if (typeof v === 'number') return String(v)
  if (Array.isArray(v)) return `{${v.join(',')}}`
  return String(v).replace(/[\\\t\n\r]/g, (c) =>
    c === '\\' ? '\\\\' : c === '\t' ? '\\t' : c === '\n' ? '\\n' : '\\r',
  )
}

export interface CopyContext {
  holeId: number
  surveyRevision: number
  importId: string
  userId: number
}

/** One structure as COPY writes it, each value under its column's key (a true orientation as input). */
function copyRow(
  ctx: CopyContext,
  s: StructureInputT,
  c: StructureComputed,
): Record<CopyKey, unknown> {
  return {
    holeId: ctx.holeId,
    depth: s.depth,
    type: s.type,
    source: s.source ?? 'core',
    alpha: s.alpha,
    beta: s.beta,
    gamma: s.gamma,
    referenceLine: s.referenceLine,
    inputDip: s.source === 'true' ? s.dip : null,
    inputDipDirection: s.source === 'true' ? s.dipDirection : null,
    roughness: s.roughness,
    jrc: s.jrc,
    apertureMm: s.apertureMm,
    infillType: s.infillType,
    infillThicknessMm: s.infillThicknessMm,
    persistence: s.persistence,
    wallWeathering: s.wallWeathering,
    state: s.state,
    confidence: s.confidence,
    comment: s.comment ?? '',
    importId: ctx.importId,
    createdBy: ctx.userId,
    updatedBy: ctx.userId,
    ...computedValues(c, ctx.surveyRevision),
  }
}

/**
 * Streams structures into the table with COPY on the transaction's own connection, reporting
 * progress every `every` rows. Much faster than INSERT for large imports.
 */
export async function copyStructures(
  client: PoolClient,
  ctx: CopyContext,
  inputs: readonly StructureInputT[],
  computed: readonly StructureComputed[],
  onProgress: (done: number) => Promise<void>,
  every = 10_000,
): Promise<void> {
  async function* lines() {
    let chunk = ''
    for (let i = 0; i < inputs.length; i++) {
      const row = copyRow(ctx, inputs[i], computed[i])
      chunk += copyKeys.map((k) => field(row[k])).join('\t') + '\n'
      if ((i + 1) % 1000 === 0) {
        yield chunk
        chunk = ''
      }
      if ((i + 1) % every === 0) await onProgress(i + 1)
    }
    if (chunk) yield chunk
  }
  const columns = copyKeys.map((k) => structures[k].name).join(', ')
  const sink = client.query(copyFrom(`copy structures (${columns}) from stdin`))
  await pipeline(Readable.from(lines()), sink)
}
