// The app's font for exported images: an SVG drawn as an image (PNG export) or opened elsewhere
// cannot reach the page's fonts, so the Fira Sans faces in use are embedded as data URLs.

const FAMILY = 'Fira Sans'
/** The weights our drawings use, and the subsets their text needs (Latin; Greek for σ). */
const WEIGHTS = ['400', '500', '600']
const SUBSET = /-(latin|greek)-(\d{3})-normal[^/]*\.woff2/

let cached: Promise<string> | null = null

function faceUrls(): { url: string; weight: string; range: string }[] {
  const found = new Map<string, { weight: string; range: string }>()
  for (const sheet of Array.from(document.styleSheets)) {
    let rules: CSSRuleList
    try {
      rules = sheet.cssRules
    } catch {
      continue // a stylesheet of another origin: not ours
    }
    for (const rule of Array.from(rules)) {
      if (!(rule instanceof CSSFontFaceRule)) continue
      if (!rule.style.getPropertyValue('font-family').includes(FAMILY)) continue
      const src = rule.style.getPropertyValue('src')
      const url = /url\(["']?([^"')]+\.woff2)["']?\)/.exec(src)?.[1]
      const match = url ? SUBSET.exec(url) : null
      if (url && match && WEIGHTS.includes(match[2]))
        found.set(new URL(url, sheet.href ?? location.href).href, {
          weight: match[2],
          range: rule.style.getPropertyValue('unicode-range'),
        })
    }
  }
  return [...found].map(([url, face]) => ({ url, ...face }))
}

function toBase64(buffer: ArrayBuffer): string {
  const bytes = new Uint8Array(buffer)
  let binary = ''
  for (let i = 0; i < bytes.length; i += 0x8000)
    binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000))
  return btoa(binary)
}

async function build(): Promise<string> {
  const faces = await Promise.all(
    faceUrls().map(async ({ url, weight, range }) => {
      try {
        const response = await fetch(url)
        if (!response.ok) return ''
        const data = toBase64(await response.arrayBuffer())
        // The subsets share family and weight: unicode-range keeps each to its characters.
        const unicode = range ? `unicode-range:${range};` : ''
        return `@font-face{font-family:'${FAMILY}';font-weight:${weight};font-style:normal;${unicode}src:url(data:font/woff2;base64,${data}) format('woff2');}`
      } catch {
        return '' // the image falls back to a system sans-serif
      }
    }),
  )
  return faces.filter(Boolean).join('\n')
}

/** @font-face rules with the font embedded; fetched once per page. */
export function embeddedFontCss(): Promise<string> {
  if (typeof document === 'undefined' || typeof fetch !== 'function') return Promise.resolve('')
  cached ??= build()
  return cached
}
