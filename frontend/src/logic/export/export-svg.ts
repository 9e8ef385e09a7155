// SVG and PNG images of what is on screen: each drawn element gets its computed style inline, the
// app's font is embedded, and the PNG is the same SVG drawn at twice its size.
import { embeddedFontCss } from './export-fonts'

const SVG_NS = 'http://www.w3.org/2000/svg'

/** Presentation properties copied from the computed style (everything our drawings use). */
const STYLE_PROPERTIES = [
  'display',
  'visibility',
  'opacity',
  'fill',
  'fill-opacity',
  'fill-rule',
  'stroke',
  'stroke-width',
  'stroke-opacity',
  'stroke-dasharray',
  'stroke-linecap',
  'stroke-linejoin',
  'paint-order',
  'font-family',
  'font-size',
  'font-weight',
  'font-style',
  'text-anchor',
  'dominant-baseline',
] as const

function inlineStyles(source: Element, target: Element) {
  const computed = getComputedStyle(source)
  const style = STYLE_PROPERTIES.map((p) => {
    const value = computed.getPropertyValue(p)
    return value ? `${p}:${value}` : ''
  })
    .filter(Boolean)
    .join(';')
  if (style) target.setAttribute('style', style)
  target.removeAttribute('class')
  for (let i = 0; i < source.children.length; i++) {
    const s = source.children[i]
    const t = target.children[i]
    if (s && t) inlineStyles(s, t)
  }
}

/** Pixel size of an SVG: its width/height attributes, else its viewBox, else its box. */
export function svgSize(svg: SVGSVGElement): { width: number; height: number } {
  const w = Number(svg.getAttribute('width'))
  const h = Number(svg.getAttribute('height'))
  if (w > 0 && h > 0) return { width: w, height: h }
  const box = svg
    .getAttribute('viewBox')
    ?.split(/[\s,]+/)
    .map(Number)
  if (box && box.length === 4 && box[2] > 0 && box[3] > 0) return { width: box[2], height: box[3] }
  const rect = svg.getBoundingClientRect()
  return { width: rect.width || 300, height: rect.height || 300 }
}

/** A standalone copy of an on-screen SVG with inline styles and explicit size. */
export function standaloneCopy(svg: SVGSVGElement): SVGSVGElement {
  const copy = svg.cloneNode(true) as SVGSVGElement
  inlineStyles(svg, copy)
  const { width, height } = svgSize(svg)
  copy.setAttribute('xmlns', SVG_NS)
  copy.setAttribute('width', String(width))
  copy.setAttribute('height', String(height))
  copy.style.removeProperty('display')
  return copy
}

/**
 * One SVG of several on-screen SVGs side by side (e.g. the depth ruler and a track), on a
 * background of the panel colour, with the font embedded.
 */
export async function composeSvg(parts: SVGSVGElement[], gap = 6): Promise<string> {
  const root = document.createElementNS(SVG_NS, 'svg')
  root.setAttribute('xmlns', SVG_NS)
  let x = 0
  let height = 0
  const copies = parts.map((part) => {
    const copy = standaloneCopy(part)
    const size = svgSize(part)
    copy.setAttribute('x', String(x))
    copy.setAttribute('y', '0')
    x += size.width + gap
    height = Math.max(height, size.height)
    return copy
  })
  const width = Math.max(1, x - gap)
  root.setAttribute('width', String(width))
  root.setAttribute('height', String(height))
  root.setAttribute('viewBox', `0 0 ${width} ${height}`)
  const background = document.createElementNS(SVG_NS, 'rect')
  background.setAttribute('width', '100%')
  background.setAttribute('height', '100%')
  const panel = parts[0] ? getComputedStyle(parts[0]).getPropertyValue('--dd-panel').trim() : ''
  background.setAttribute('fill', panel || '#ffffff')
  const fonts = await embeddedFontCss()
  if (fonts) {
    const style = document.createElementNS(SVG_NS, 'style')
    style.textContent = fonts
    root.appendChild(style)
  }
  root.appendChild(background)
  copies.forEach((c) => root.appendChild(c))
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(root)}`
}

/** Rasterises SVG text at `scale` times its size (2 by default) into a PNG blob. */
export async function svgToPng(svgText: string, scale = 2): Promise<Blob> {
  const url = URL.createObjectURL(new Blob([svgText], { type: 'image/svg+xml' }))
  try {
    const image = new Image()
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve()
      image.onerror = () => reject(new Error('The image could not be drawn.'))
      image.src = url
    })
    const canvas = document.createElement('canvas')
    canvas.width = Math.round(image.width * scale)
    canvas.height = Math.round(image.height * scale)
    const context = canvas.getContext('2d')
    if (!context) throw new Error('No canvas to draw on.')
    context.scale(scale, scale)
    context.drawImage(image, 0, 0)
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('PNG failed.'))), 'image/png'),
    )
  } finally {
    URL.revokeObjectURL(url)
  }
}

export function download(blob: Blob, fileName: string) {
  const url = URL.createObjectURL(blob)
  const a = document.createElement('a')
  a.href = url
  a.download = fileName
  document.body.appendChild(a)
  a.click()
  a.remove()
  setTimeout(() => URL.revokeObjectURL(url), 10_000)
}

/** Downloads on-screen SVGs (side by side) as `<name>.svg` or `<name>.png`. */
export async function exportImage(parts: SVGSVGElement[], name: string, format: 'svg' | 'png') {
  const text = await composeSvg(parts)
  if (format === 'svg') download(new Blob([text], { type: 'image/svg+xml' }), `${name}.svg`)
  else download(await svgToPng(text), `${name}.png`)
}
