import { intersectionsCsv, setsCsv, structuresCsv } from './csv'
import { writeAgs } from './ags4-write'
import { validateAgs } from './ags4-validate'
import { sha256Hex } from './hash'
import { netFigure } from './net-geometry'
import { netSvg } from './net-svg'
import { svgToPng } from './net-png'
import type { PackData } from './pack-data'
import { buildReport } from './pdf-report'
import type { NetProjection } from '../../../orient/index'

export interface PackFile {
  name: string
  mime: string
  sha256: string
  bytes: Buffer
}

export interface PackMeta {
  packId: string
  builtBy: string
  builtAt: Date
}

const file = (name: string, mime: string, bytes: Buffer): PackFile => ({
  name,
  mime,
  bytes,
  sha256: sha256Hex(bytes),
})

/**
 * Every file of a pack from data read once. The AGS4 file must pass our validator: a writer bug
 * fails the build instead of reaching a designer.
 */
export async function buildPackFiles(
  data: PackData,
  meta: PackMeta,
  onProgress: (percent: number, message: string) => Promise<void>,
): Promise<PackFile[]> {
  const csv = 'text/csv; charset=utf-8'
  const files = [
    file('structures.csv', csv, Buffer.from(structuresCsv(data), 'utf8')),
    file('sets.csv', csv, Buffer.from(setsCsv(data), 'utf8')),
    file('intersections.csv', csv, Buffer.from(intersectionsCsv(data), 'utf8')),
  ]
  await onProgress(40, 'CSV written')
  const ags = writeAgs(data, { packId: meta.packId, generatedAt: meta.builtAt })
  const issues = validateAgs(ags)
  if (issues.length)
    throw new Error(
      `AGS4 output failed validation: ${issues
        .slice(0, 5)
        .map((i) => `line ${i.line} ${i.message}`)
        .join('; ')}`,
    )
  files.push(file('project.ags', 'text/plain; charset=us-ascii', Buffer.from(ags, 'ascii')))
  await onProgress(55, 'AGS4 written and validated')
  const projection = data.project.netProjection as NetProjection
  for (const p of data.intervals) {
    const title = `${data.project.code} ${p.hole.name} ${p.interval.name} (${p.interval.fromDepth}-${p.interval.toDepth} m)`
    const svg = netSvg(netFigure(p.analysis, projection), title, projection)
    files.push(file(`net-${p.interval.id}.svg`, 'image/svg+xml', Buffer.from(svg, 'utf8')))
    files.push(file(`net-${p.interval.id}.png`, 'image/png', svgToPng(svg)))
  }
  await onProgress(70, 'Nets drawn')
  const pdf = await buildReport(data, meta)
  files.push(file('report.pdf', 'application/pdf', pdf))
  await onProgress(95, 'Report written')
  return files
}
