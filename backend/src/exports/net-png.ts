import { Resvg } from '@resvg/resvg-js'

/**
 * Rasterises a net SVG to PNG at twice its drawn size. Text uses the machine's fonts (resvg reads
 * TTF/OTF, not the WOFF files we ship for the app), falling back to any sans-serif face.
 */
export function svgToPng(svg: string): Buffer {
  const resvg = new Resvg(svg, {
    fitTo: { mode: 'zoom', value: 2 },
    background: '#ffffff',
    font: { loadSystemFonts: true, defaultFontFamily: 'DejaVu Sans' },
  })
  return resvg.render().asPng()
}
