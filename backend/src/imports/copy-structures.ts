import { Readable } from 'node:stream'
import { pipeline } from 'node:stream/promises'
import type { PoolClient } from 'pg'
import { from as copyFrom } from 'pg-copy-streams'
import type { StructureInputT } from '../../../schema/index'
import type { StructureComputed } from '../../../orient/index'

/** Columns written by COPY, in order; everything else takes its default. */
const columns = [
  'hole_id',
  'depth',
  'type',
  'source',
  'alpha',
  'beta',
  'gamma',
  'reference_line',
  'input_dip',
  'input_dip_direction',
  'dip',
  'dip_direction',
  'pole_trend',
  'pole_plunge',
  'hole_trend',
  'hole_plunge',
  'east',
  'north',
  'elevation',
  'terzaghi_weight',
  'declination_applied',
  'survey_revision',
  'flags',
  'roughness',
  'jrc',
  'aperture_mm',
  'infill_type',
  'infill_thickness_mm',
  'persistence',
  'wall_weathering',
  'state',
  'confidence',
  'comment',
  'import_id',
  'created_by',
  'updated_by',
] as const

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
      const s = inputs[i]
      const c = computed[i]
      const values = [
        ctx.holeId,
        s.depth,
        s.type,
        s.source ?? 'core',
        s.alpha,
        s.beta,
        s.gamma,
        s.referenceLine,
        s.source === 'true' ? s.dip : null,
        s.source === 'true' ? s.dipDirection : null,
        c.dip,
        c.dipDirection,
        c.poleTrend,
        c.polePlunge,
        c.holeTrend,
        c.holePlunge,
        c.east,
        c.north,
        c.elevation,
        c.terzaghiWeight,
        c.declinationApplied,
        ctx.surveyRevision,
        c.flags,
        s.roughness,
        s.jrc,
        s.apertureMm,
        s.infillType,
        s.infillThicknessMm,
        s.persistence,
        s.wallWeathering,
        s.state,
        s.confidence,
        s.comment ?? '',
        ctx.importId,
        ctx.userId,
        ctx.userId,
      ]
      chunk += values.map(field).join('\t') + '\n'
      if ((i + 1) % 1000 === 0) {
        yield chunk
        chunk = ''
      }
      if ((i + 1) % every === 0) await onProgress(i + 1)
    }
    if (chunk) yield chunk
  }
  const sink = client.query(copyFrom(`copy structures (${columns.join(', ')}) from stdin`))
  await pipeline(Readable.from(lines()), sink)
}
