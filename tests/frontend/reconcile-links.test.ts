import { afterEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import { defineComponent, h } from 'vue'
import { createMemoryHistory, createRouter } from 'vue-router'
import { useMatchLinks } from '../../frontend/src/composables/use-reconciliation'
import TrackMatchLinks from '../../frontend/src/components/track/TrackMatchLinks.vue'
import TrackPanel from '../../frontend/src/components/track/TrackPanel.vue'
import { matchLinks } from '../../frontend/src/logic/reconcile/match-links'
import type { DepthRange } from '../../frontend/src/logic/track/track-types'
import { mockFetch } from './fetch-mock'
import { matches, reconciliationAnswer } from './reconcile-fixture'

// With a shift of 0.30 m in force the image tadpoles are drawn 0.30 m above their logged depths.
const answer = reconciliationAnswer({ appliedDepthShift: 0.3 })
const links = matchLinks(answer)
/** The tracks' depth scale: y = (depth − top) / (bottom − top) · height (TrackFrame). */
const yOf = (depth: number, [top, bottom]: DepthRange, height: number) =>
  ((depth - top) / (bottom - top)) * height

const lines = (w: ReturnType<typeof mount>) =>
  w.findAll('[data-testid="match-links"] line').map((l) => ({
    core: Number(l.attributes('data-core')),
    x1: Number(l.attributes('x1')),
    y1: Number(l.attributes('y1')),
    x2: Number(l.attributes('x2')),
    y2: Number(l.attributes('y2')),
  }))

describe('matchLinks()', () => {
  it('matchLinks(): the image end sits at the logged image depth less the shift in force', () => {
    expect(links).toHaveLength(13)
    expect(links[0]).toEqual({
      coreId: 100,
      imageId: 200,
      coreDepth: 39.4,
      imageDepth: 39.7551 - 0.3,
    })
    // Only pairs whose two structures pass the depth view's filters.
    const kept = new Set([100, 200, 101, 205])
    expect(matchLinks(answer, kept).map((l) => l.coreId)).toEqual([100])
  })
})

describe('TrackMatchLinks', () => {
  it('TrackMatchLinks: one line per pair in view, core depth at the left, shown image depth at the right', () => {
    const domain: DepthRange = [40, 45]
    const w = mount(TrackMatchLinks, { props: { links, width: 56, height: 500, domain } })
    const drawn = lines(w)
    // Core 39.4/39.9 m have their image ends at 39.455/39.934 m: outside 40–45 m, not drawn;
    // core 45.5 m links to 45.557 m, 46.7 m to 46.748 m: below, not drawn. Nine remain.
    const inView = matches.filter((m) => m.coreDepth >= 40 && m.coreDepth <= 45)
    expect(drawn.map((l) => l.core)).toEqual(inView.map((m) => m.coreStructureId))
    drawn.forEach((l, i) => {
      const m = inView[i]
      expect(l.x1).toBe(0)
      expect(l.x2).toBe(56)
      expect(l.y1).toBeCloseTo(yOf(m.coreDepth, domain, 500), 6)
      expect(l.y2).toBeCloseTo(yOf(m.imageDepth - 0.3, domain, 500), 6)
    })
    // 42.3 m core: (42.3 − 40) / 5 · 500 = 230 px; its image at 42.6396 − 0.3 = 42.3396 m → 233.96 px.
    const at423 = drawn.find((l) => l.core === 105)!
    expect(at423.y1).toBeCloseTo(230, 6)
    expect(at423.y2).toBeCloseTo(233.96, 6)
  })

  it('TrackMatchLinks: a zoomed domain moves every line with the other tracks, and the wheel asks to zoom', async () => {
    // A pair straddling the top edge (core 41.95 m above it, image 42.05 m below) stays drawn.
    const straddling = { coreId: 900, imageId: 901, coreDepth: 41.95, imageDepth: 42.05 }
    const w = mount(TrackMatchLinks, {
      props: {
        links: [...links, straddling],
        width: 56,
        height: 500,
        domain: [40, 45] as DepthRange,
      },
    })
    await w.setProps({ domain: [42, 43] as DepthRange })
    const drawn = lines(w)
    // In 42–43 m: cores 42.3 and 42.9 m (images 42.3396 and 42.9523 m) and the straddling pair.
    expect(drawn.map((l) => l.core)).toEqual([105, 106, 900])
    expect(drawn[0].y1).toBeCloseTo((42.3 - 42) * 500, 6)
    expect(drawn[1].y2).toBeCloseTo((42.9523 - 42) * 500, 6)
    expect(drawn[2].y1).toBeCloseTo(-25, 6)
    expect(drawn[2].y2).toBeCloseTo(25, 6)
    await w.get('svg').trigger('wheel', { deltaY: -100, clientY: 300 })
    expect(w.emitted('zoom')).toHaveLength(1)
  })
})

describe('TrackPanel with pair links', () => {
  const base = {
    domain: [40, 45] as DepthRange,
    height: 500,
    core: [],
    image: [],
    showImage: true,
    depths: [],
    runs: [],
    curves: [],
    intervals: [],
    brush: null,
    selectedId: 105,
    marker: null,
  }

  it('TrackPanel: the pair track sits between the core and image tadpoles, only when links are given', () => {
    const w = mount(TrackPanel, { props: { ...base, matchLinks: links } })
    const order = w.findAll('[data-track]').map((t) => t.attributes('data-track'))
    expect(order.slice(0, 4)).toEqual(['ruler', 'core', 'match-links', 'image'])
    expect(w.findAll('[data-track="match-links"] line')).toHaveLength(9)
    expect(w.find('[data-track="match-links"] line.selected').attributes('data-core')).toBe('105')
    const off = mount(TrackPanel, { props: { ...base, matchLinks: null } })
    expect(off.find('[data-track="match-links"]').exists()).toBe(false)
  })
})

describe('useMatchLinks()', () => {
  afterEach(() => vi.unstubAllGlobals())

  it('useMatchLinks(): off by default; on, it is kept in the address and fetches the defaults once', async () => {
    const calls = mockFetch(() => ({ body: { data: answer } }))
    const router = createRouter({
      history: createMemoryHistory(),
      routes: [{ path: '/depth', component: { render: () => null } }],
    })
    await router.push('/depth')
    let pairs: ReturnType<typeof useMatchLinks> | undefined
    const Host = defineComponent({
      setup() {
        pairs = useMatchLinks(
          () => '1',
          () => '7',
          () => true,
          () => [{ id: 100 }, { id: 200 }, { id: 101 }, { id: 201 }],
        )
        return () => h('div')
      },
    })
    mount(Host, { global: { plugins: [router] } })
    await flushPromises()
    expect(pairs!.shown.value).toBe(false)
    expect(pairs!.links.value).toBeNull()
    expect(calls).toHaveLength(0)
    pairs!.shown.value = true
    await flushPromises()
    expect(router.currentRoute.value.query.links).toBe('pairs')
    expect(calls.map((c) => c.url)).toEqual(['/api/projects/1/holes/7/reconciliation'])
    expect(pairs!.links.value!.map((l) => l.coreId)).toEqual([100, 101])
    pairs!.shown.value = false
    await flushPromises()
    pairs!.shown.value = true
    await flushPromises()
    expect(calls).toHaveLength(1)
  })
})
