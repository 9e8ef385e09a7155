/**
 * Writes the image test files (npx tsx testdata/images/make-images.ts). Everything is made from
 * code here — sharp for ordinary rasters, bytes by hand for the baseline TIFF and the hostile
 * files — so the files can be remade and checked; the tests read the committed copies.
 */
import { writeFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import * as r from './raster-files'
import { amp72, amplitude, bracketArray, lasText, regularDepths, travelTime } from './las-files'

const dir = fileURLToPath(new URL('.', import.meta.url))
const write = (name: string, bytes: Uint8Array | string) => writeFileSync(dir + name, bytes)

async function rasters() {
  write('gsq-bh01-amp-grey8.png', await r.png8(72, 600))
  write('gsq-bh01-amp-grey16.png', await r.png16(90, 520))
  write('gsq-bh02-optical-rgb.jpg', await r.jpegRgb(120, 400))
  write('gsq-bh02-amp-grey8.jpg', await r.jpegGrey(64, 300))
  write('gsq-bh03-amp-grey8.tif', await r.tiffGrey8(80, 300))
  write('gsq-bh03-optical-rgb.tif', await r.tiffRgb(100, 280))
  write('gsq-bh03-amp-grey16.tif', r.baselineTiff(64, 300, r.grey16(64, 300), 40))
  write('gsq-bh04-palette-grey.png', await r.pngPaletteGrey(72, 300))
  write('gsq-bh04-grey-alpha.png', await r.pngGreyAlpha(72, 300))
  write('gsq-bh04-optical-rgb16.png', await r.pngRgb16(60, 280))
}

async function hostile() {
  const png = await r.png8(72, 600)
  write('broken-truncated.png', png.subarray(0, png.length >> 1))
  const flipped = Buffer.from(png)
  for (let i = 100; i < 140; i++) flipped[i] ^= 0x5a
  write('broken-crc.png', flipped)
  const jpg = await r.jpegGrey(64, 300)
  write('broken-no-eoi.jpg', jpg.subarray(0, jpg.length - 400))
  write('broken-strips.tif', r.baselineTiff(64, 300, r.grey16(64, 300), 40, 5000))
  // decompression bombs: honest deflate streams of zeros, a few hundred kB each
  write('bomb-40000x40000.png', r.zeroPng(40000, 40000, 1))
  write('bomb-1x100000000.png', r.zeroPng(1, 100_000_000, 8))
  write('not-an-image.gif', Buffer.from('GIF89a\x01\x00\x01\x00\x80\x00\x00\xff\xff\xff\x00\x00\x00;'))
}

function las() {
  const rows = 300
  write(
    'gsq-bh05-amp72.las',
    lasText({
      version: '2.0',
      well: 'GSQ-BH05',
      depths: regularDepths(20, 0.002, rows),
      parameters: [
        ' AZSTEP .DEG  5.0 : AZIMUTH STEP OF THE IMAGE',
        ' AZSTART.DEG  2.5 : AZIMUTH OF THE FIRST SAMPLE',
        ' BS     .IN   3.780 : BIT SIZE',
      ],
      curves: [{ head: 'CALI.IN', description: 'CALIPER', value: (i) => 3.9 + 0.02 * Math.sin(i) }],
      arrays: [amp72(rows)],
    }),
  )
  write(
    'gsq-bh05-amp-tt-brackets.las',
    lasText({
      version: '2.0',
      well: 'GSQ-BH05',
      depths: regularDepths(30, 0.002, 300),
      parameters: [' BS.IN  3.875 : BIT SIZE'],
      arrays: [
        bracketArray('AMP', 'MV', 36, 0, amplitude(36, 300)),
        bracketArray('TT', 'US', 36, 0, travelTime(36, 300)),
      ],
    }),
  )
  write(
    'gsq-bh06-las3-array.las',
    lasText({
      version: '3.0',
      well: 'GSQ-BH06',
      depths: regularDepths(12, 0.004, 100),
      parameters: [' AZ_STEP .DEG 15 : AZIMUTH STEP {F}'],
      arrays: [bracketArray('AMP', 'MV', 24, 1, amplitude(24, 100))],
    }),
  )
  const irregular = [...regularDepths(15, 0.005, 50), ...regularDepths(15.2525, 0.0025, 50)]
  write(
    'gsq-bh06-irregular.las',
    lasText({
      version: '2.0',
      well: 'GSQ-BH06',
      depths: irregular,
      arrays: [{ ...amp72(100), members: 16, name: (i) => `AMP_${i + 1}` }],
    }),
  )
  write(
    'gsq-bh06-bottom-up.las',
    lasText({
      version: '2.0',
      well: 'GSQ-BH06',
      depths: regularDepths(40.1, -0.002, 51),
      nullValue: -9999,
      arrays: [{ ...amp72(51), members: 8 }],
    }),
  )
  brokenLas()
}

function brokenLas() {
  const base = { version: '2.0' as const, well: 'GSQ-BH05', depths: regularDepths(20, 0.002, 40) }
  const gap = { ...amp72(40), members: 12, name: (i: number) => `AMP${i < 6 ? i + 1 : i + 2}` }
  write('broken-array-gap.las', lasText({ ...base, arrays: [gap] }))
  write(
    'broken-azimuth-step.las',
    lasText({
      ...base,
      parameters: [' AZSTEP.DEG 40 : AZIMUTH STEP'],
      arrays: [{ ...amp72(40), members: 8 }],
    }),
  )
  write(
    'broken-row-step.las',
    lasText({ ...base, depths: regularDepths(20, 0.1, 40), arrays: [{ ...amp72(40), members: 8 }] }),
  )
  write(
    'broken-no-array.las',
    lasText({
      ...base,
      curves: [{ head: 'GR.GAPI', description: 'GAMMA', value: (i) => 40 + i }],
      arrays: [],
    }),
  )
  // 5,000 curves over 10,000 lines: the reader would allocate 400 MB for a 70 kB file
  const defs = Array.from({ length: 5000 }, (_, i) => ` C${i}.  : X`)
  const lines = Array.from({ length: 10000 }, (_, i) => String(i))
  write(
    'broken-curve-bomb.las',
    ['~V', ' VERS. 2.0 :', ' WRAP. NO :', '~W', ' NULL. -999.25 :', '~C', ' DEPT.M :', ...defs, '~A', ...lines, ''].join('\n'),
  )
}

await rasters()
await hostile()
las()
console.log('image test files written to', dir)
