import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import TrackFrame from '../../frontend/src/components/track/TrackFrame.vue'
import { TRACK_HEADER } from '../../frontend/src/logic/track/track-types'
import { useDepthAxis } from '../../frontend/src/composables/use-depth-axis'

// happy-dom lays nothing out: the svg's box is at (0, 0), so clientY is the offset in the track.
const at = (clientY: number) => ({ clientX: 10, clientY, button: 0, pointerId: 1 })

describe('TrackFrame', () => {
  const props = { title: 'Test', width: 100, height: 500, domain: [0, 100] as [number, number] }

  it('brushes the dragged depth range (top to bottom, whichever way dragged)', async () => {
    const wrapper = mount(TrackFrame, { props })
    const svg = wrapper.get('svg')
    await svg.trigger('pointerdown', at(TRACK_HEADER + 300))
    await svg.trigger('pointermove', at(TRACK_HEADER + 250))
    await svg.trigger('pointermove', at(TRACK_HEADER + 200))
    // Moves within one frame are merged into one brush, sent at the frame.
    await new Promise((resolve) => requestAnimationFrame(() => resolve(null)))
    expect(wrapper.emitted('brush')).toEqual([[[40, 60], false]])
    await svg.trigger('pointerup', at(TRACK_HEADER + 100))
    expect(wrapper.emitted('brush')!.at(-1)).toEqual([[20, 60], true])
  })

  it('passes a still click on with its depth', async () => {
    const wrapper = mount(TrackFrame, { props })
    const svg = wrapper.get('svg')
    await svg.trigger('pointerdown', at(TRACK_HEADER + 250))
    await svg.trigger('pointerup', at(TRACK_HEADER + 251))
    expect(wrapper.emitted('brush')).toBeUndefined()
    const p = wrapper.emitted('click')![0][0] as { depth: number }
    expect(p.depth).toBeCloseTo(50.2, 6)
  })

  it('draws the brush band where the range is', () => {
    const wrapper = mount(TrackFrame, { props: { ...props, brush: [10, 30] as [number, number] } })
    const band = wrapper.get('[data-testid="track-brush"]')
    expect(Number(band.attributes('data-top'))).toBeCloseTo(50, 6)
    expect(Number(band.attributes('data-height'))).toBeCloseTo(100, 6)
    expect(band.attributes('style')).toContain(`translateY(${TRACK_HEADER + 50}px)`)
  })
})

describe('useDepthAxis()', () => {
  it('zooms about a depth, pans and stays inside the hole', () => {
    const axis = useDepthAxis(() => [0, 200])
    axis.reset()
    expect(axis.domain.value).toEqual([0, 200])
    axis.zoomAt(50, 0.5)
    expect(axis.domain.value).toEqual([25, 125])
    axis.panBy(100)
    expect(axis.domain.value).toEqual([100, 200])
    axis.panBy(-500)
    expect(axis.domain.value).toEqual([0, 100])
    axis.zoomAt(10, 10)
    expect(axis.domain.value).toEqual([0, 200])
  })
})
