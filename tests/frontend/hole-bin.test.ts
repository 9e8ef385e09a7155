import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import ProjectHoleBin from '../../frontend/src/components/project/ProjectHoleBin.vue'
import type { DeletedHole } from '../../frontend/src/api/holes'
import { withPrimeVue } from './mount-options'

const row = (over: Partial<DeletedHole> = {}): DeletedHole => ({
  id: 7,
  name: 'GSQ-BH09',
  deletedAt: '2026-11-20T10:00:00.000Z',
  deletedBy: 'Lead',
  restorableUntil: '2026-12-20T10:00:00.000Z',
  structures: 1234,
  runs: 40,
  stations: 12,
  intervals: 3,
  issuedIntervals: 0,
  curves: 2,
  ...over,
})

describe('ProjectHoleBin', () => {
  it('lists what a deleted hole holds and until when; Restore emits the row', async () => {
    const w = mount(ProjectHoleBin, {
      ...withPrimeVue,
      props: { rows: [row()], error: null, canPurge: false },
    })
    const text = w.get('[data-testid="bin-GSQ-BH09"]').text()
    expect(text).toContain('1234 structures, 40 runs, 3 intervals')
    expect(text).toContain('2026-12-20')
    expect(w.findAll('button').map((b) => b.text())).toEqual(['Restore'])
    await w.get('button').trigger('click')
    expect(w.emitted('restore')?.[0]).toEqual([row()])
  })

  it('Purge is offered to administrators, and disabled while issued intervals are in the hole', () => {
    const w = mount(ProjectHoleBin, {
      ...withPrimeVue,
      props: { rows: [row({ issuedIntervals: 1 })], error: null, canPurge: true },
    })
    const purge = w.findAll('button').find((b) => b.text() === 'Purge')!
    expect(purge.attributes('disabled')).toBeDefined()
    expect(w.text()).toContain('(1 issued)')
  })
})
