import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import type { ImageMeta, ImagePickRecord } from '../../frontend/src/api/images'
import {
  imageAt,
  imageGroups,
  pickTraces,
  predictedTraces,
} from '../../frontend/src/logic/image/track-sinusoids'
import type { PredictableStructure } from '../../frontend/src/logic/image/predicted'
import { azimuthTicks, referenceWords } from '../../frontend/src/logic/image/azimuth-scale'
import ImageAzimuthScale from '../../frontend/src/components/image/ImageAzimuthScale.vue'
import ImageCanvas from '../../frontend/src/components/image/ImageCanvas.vue'
import { defaultDisplay } from '../../frontend/src/logic/image/image-types'
import { expectAngle } from '../orient/expect-angle'

const image = (id: number, extra: Partial<ImageMeta> = {}): ImageMeta => ({
  id,
  holeId: 2,
  kind: 'amplitude',
  source: 'raster',
  name: `GSQ-BH02 amp ${id}`,
  fileName: `gsq-bh02-${id}.png`,
  mediaType: 'image/png',
  fileSize: 1000,
  topDepth: 40,
  bottomDepth: 60,
  width: 360,
  height: 10000,
  channels: 1,
  sampleBits: 8,
  valueMin: null,
  valueMax: null,
  valueUnit: null,
  leftAzimuth: 0,
  azimuthReference: 'north',
  northReference: 'true',
  diameterMm: 96,
  diameterSource: 'entered',
  tileRows: 256,
  levels: 7,
  status: 'ready',
  progress: 100,
  message: '',
  notes: [],
  createdAt: `2025-03-0${id}T10:00:00Z`,
  createdBy: 1,
  pickCount: 0,
  ...extra,
})
const structure = (extra: Partial<PredictableStructure>): PredictableStructure => ({
  id: 1,
  depth: 50,
  type: 'joint',
  source: 'image',
  dip: 45,
  dipDirection: 90,
  holeTrend: 0,
  holePlunge: 90,
  declinationApplied: 0,
  ...extra,
})

describe('image track', () => {
  it('imageGroups() keeps ready images, one group per kind and reference, oldest first', () => {
    const groups = imageGroups([
      image(3),
      image(1),
      image(2, { kind: 'traveltime' }),
      image(4, { status: 'processing' }),
      image(5, { azimuthReference: 'highside', northReference: null }),
    ])
    expect(groups.map((g) => g.label)).toEqual([
      'Amplitude · from true north',
      'Amplitude · from high side',
      'Travel time',
    ])
    expect(groups[0].images.map((i) => i.id)).toEqual([1, 3])
  })

  it('imageAt() takes the newest image covering the depth, else the newest', () => {
    const list = [image(1), image(2, { topDepth: 55, bottomDepth: 80 })]
    expect(imageAt(list, 45)?.id).toBe(1)
    expect(imageAt(list, 57)?.id).toBe(2)
    expect(imageAt(list, 200)?.id).toBe(2)
  })

  it('pickTraces() draws a raw pick as picked, and a pick from another image from its plane', () => {
    const group = [image(1)]
    const record = {
      structureId: 11,
      imageId: 1,
      points: [],
      centreDepth: 50.01,
      heightMm: 55,
      troughAzimuth: 123,
      diameterMm: 96,
      azimuthReference: 'north',
      northReference: 'true',
      rmsMm: 1,
      suggested: false,
      structure: {} as ImagePickRecord['structure'],
    } as ImagePickRecord
    const traces = pickTraces(
      [structure({ id: 11 }), structure({ id: 12 }), structure({ id: 13, source: 'core' })],
      new Map([[11, record]]),
      group,
      12,
    )
    expect(traces.map((t) => t.key)).toEqual(['pick:11', 'pick:12'])
    expect(traces[0]).toMatchObject({
      depth: 50.01,
      height: 0.055,
      troughAzimuth: 123,
      role: 'pick',
    })
    // Plane 090/45 in a vertical hole on a 96 mm true-north image: H 96 mm, trough 090.
    expect(traces[1].height).toBeCloseTo(0.096, 9)
    expectAngle(traces[1].troughAzimuth, 90, 1e-6)
    expect(traces[1].selected).toBe(true)
  })

  it('predictedTraces() takes core structures inside an image, in that image’s frame', () => {
    const group = [image(1), image(2, { topDepth: 60, bottomDepth: 80, diameterMm: 150 })]
    const traces = predictedTraces(
      [
        structure({ id: 1, source: 'core', depth: 50 }),
        structure({ id: 2, source: 'core', depth: 70 }),
        structure({ id: 3, source: 'core', depth: 120 }),
        structure({ id: 4, depth: 50 }),
      ],
      group,
      null,
    )
    expect(traces.map((t) => [t.key, +t.height.toFixed(4)])).toEqual([
      ['predicted:1', 0.096],
      ['predicted:2', 0.15],
    ])
  })
})

describe('azimuth scale', () => {
  it('azimuthTicks() every 30°, lettered every 90°', () => {
    const north = azimuthTicks('north')
    expect(north.map((t) => t.azimuth)).toEqual([
      0, 30, 60, 90, 120, 150, 180, 210, 240, 270, 300, 330, 360,
    ])
    expect(north.filter((t) => t.label).map((t) => t.label)).toEqual(['N', 'E', 'S', 'W'])
    expect(
      azimuthTicks('highside')
        .filter((t) => t.label)
        .map((t) => t.label),
    ).toEqual(['HS', 'R', 'LS', 'L'])
  })

  it('referenceWords() says which north, or the high side', () => {
    expect(referenceWords('north', 'magnetic')).toMatch(/magnetic north/)
    expect(referenceWords('north', 'true')).toMatch(/true north/)
    expect(referenceWords('highside', null)).toMatch(/high side/)
  })

  it('ImageAzimuthScale writes the letters at their azimuths and the reference in words', () => {
    const w = mount(ImageAzimuthScale, {
      props: {
        width: 360,
        height: 40,
        reference: 'north',
        north: 'magnetic',
        title: 'Amplitude image',
      },
    })
    const letters = w.findAll('[data-testid="image-azimuth-letter"]')
    expect(letters.map((l) => l.text())).toEqual(['N', 'E', 'S', 'W'])
    expect(letters.map((l) => Number(l.attributes('x')))).toEqual([2, 90, 180, 270])
    expect(w.get('[data-testid="image-azimuth-reference"]').text()).toBe('from magnetic north')
    expect(w.get('svg').attributes('aria-label')).toMatch(
      /magnetic north, clockwise looking down-hole/,
    )
  })
})

describe('ImageCanvas', () => {
  it('is focusable, sizes its canvas in device pixels and shows the scale of the newest image', () => {
    const w = mount(ImageCanvas, {
      props: {
        projectId: 1,
        holeId: 2,
        images: [image(1), image(2, { azimuthReference: 'highside', northReference: null })],
        domain: [40, 60],
        width: 240,
        height: 500,
        display: defaultDisplay('amplitude'),
      },
    })
    expect(w.get('[data-testid="image-canvas"]').attributes('tabindex')).toBe('0')
    const canvas = w.get('canvas')
    expect(canvas.attributes('style')).toContain('width: 240px')
    expect(Number(canvas.attributes('width'))).toBe(
      Math.round(240 * (window.devicePixelRatio || 1)),
    )
    expect(w.findAll('[data-testid="image-azimuth-letter"]').map((l) => l.text())).toEqual([
      'HS',
      'R',
      'LS',
      'L',
    ])
    w.unmount()
  })
})
