import { intersectionsCsv, setsCsv, structuresCsv } from './csv'
import { writeAgs } from './ags4-write'
import { validateAgs } from './ags4-validate'
import { sha256Hex } from './hash'
import { netFigure } from './net-geometry'
import { netSvg } from './net-svg'
import { svgToPng } from './net-png'
import type { PackData } from './pack-types'
import { buildReport } from './pdf-report'
import { packHeaderLines } from './sign-off'
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
  const csvFile = (name: string, write: typeof setsCsv) =>
    file(name, csv, Buffer.from(write(data, packHeaderLines(data, meta, name)), 'utf8'))
  const files = [
    csvFile('structures.csv', structuresCsv),
    csvFile('sets.csv', setsCsv),
    csvFile('intersections.csv', intersectionsCsv),
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
    const svg = netSvg(netFigure(p.analysis, projection), title, projection, data.draft)
    files.push(file(`net-${p.interval.id}.svg`, 'image/svg+xml', Buffer.from(svg, 'utf8')))
    files.push(file(`net-${p.interval.id}.png`, 'image/png', svgToPng(svg)))
  }
  await onProgress(70, 'Nets drawn')
  const pdf = await buildReport(data, meta)
  files.push(file('report.pdf', 'application/pdf', pdf))
  await onProgress(95, 'Report written')
  return files
}
