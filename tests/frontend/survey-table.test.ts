import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import Select from 'primevue/select'
import HoleSurveyTable from '../../frontend/src/components/hole/HoleSurveyTable.vue'
import {
  rowErrors,
  rowFromStation,
  type SurveyRow,
} from '../../frontend/src/logic/hole/survey-rows'
import { withPrimeVue } from './mount-options'

const saved: SurveyRow = {
  key: 'r1',
  stationId: 11,
  depth: 0,
  azimuth: 186.5,
  azimuthReference: 'magnetic',
  plunge: 60,
  method: 'gyro',
  trueAzimuth: 188.75,
  declinationApplied: 2.25,
  convergenceApplied: 0,
}
const draft: SurveyRow = {
  key: 'r2',
  stationId: null,
  depth: 30,
  azimuth: 187,
  azimuthReference: 'true',
  plunge: 59.5,
  method: '',
  trueAzimuth: null,
  declinationApplied: null,
}

function mountTable(readonly = false) {
  return mount(HoleSurveyTable, { props: { rows: [saved, draft], readonly }, ...withPrimeVue })
}

describe('HoleSurveyTable', () => {
  it('renders one row per station with entered and corrected values', () => {
    const wrapper = mountTable()
    const rows = wrapper.findAll('tbody tr')
    expect(rows).toHaveLength(2)
    const first = rows[0]!
    const inputs = first.findAll('input')
    expect((inputs[0]!.element as HTMLInputElement).value).toBe('0')
    expect((inputs[1]!.element as HTMLInputElement).value).toBe('186.5')
    expect(first.get('[data-field="trueAzimuth"]').text()).toBe('188.75°')
    expect(first.get('[data-field="declinationApplied"]').text()).toBe('2.25° E')
    expect(rows[1]!.get('[data-field="trueAzimuth"]').text()).toBe('on save')
  })

  it('emits an edit with the parsed number when a cell changes', async () => {
    const wrapper = mountTable()
    const depth = wrapper.get('[data-testid="survey-row-1"] input[data-field="depth"]')
    await depth.setValue('45,5')
    await depth.trigger('change')
    expect(wrapper.emitted('edit')?.at(-1)).toEqual(['r2', 'depth', 45.5])

    const plunge = wrapper.get('[data-testid="survey-row-0"] input[data-field="plunge"]')
    await plunge.setValue('')
    await plunge.trigger('change')
    expect(wrapper.emitted('edit')?.at(-1)).toEqual(['r1', 'plunge', null])
  })

  it('emits an edit when the azimuth reference changes', async () => {
    const wrapper = mountTable()
    wrapper.findAllComponents(Select)[1]!.vm.$emit('update:modelValue', 'grid')
    expect(wrapper.emitted('edit')).toEqual([['r2', 'azimuthReference', 'grid']])
  })

  it('emits remove and add', async () => {
    const wrapper = mountTable()
    await wrapper.findAll('[data-testid="survey-remove"]')[0]!.trigger('click')
    await wrapper.get('[data-testid="survey-add"]').trigger('click')
    expect(wrapper.emitted('remove')).toEqual([['r1']])
    expect(wrapper.emitted('add')).toHaveLength(1)
  })

  it('shows plain text and no controls when read-only', () => {
    const wrapper = mountTable(true)
    expect(wrapper.findAll('input')).toHaveLength(0)
    expect(wrapper.find('[data-testid="survey-add"]').exists()).toBe(false)
    const cells = wrapper.findAll('[data-testid="survey-row-0"] td').map((td) => td.text())
    expect(cells).toEqual([
      '1',
      '0.00',
      '186.50°',
      'Magnetic',
      '60.00°',
      'gyro',
      '188.75°',
      '2.25° E',
      '0.000°',
    ])
  })

  it('shows the grid convergence a grid station got beside the declination', () => {
    const grid: SurveyRow = {
      ...saved,
      azimuthReference: 'grid',
      trueAzimuth: 186.655,
      declinationApplied: 0,
      convergenceApplied: 0.155,
    }
    const wrapper = mount(HoleSurveyTable, {
      props: { rows: [grid], readonly: true },
      ...withPrimeVue,
    })
    expect(wrapper.get('[data-field="convergenceApplied"]').text()).toBe('0.155° E')
    expect(wrapper.get('[data-field="declinationApplied"]').text()).toBe('0.00°')
    const heads = wrapper.findAll('th').map((th) => th.text())
    expect(heads.slice(-2)).toEqual(['Declination applied', 'Convergence applied'])
  })

  it('marks rows with errors', () => {
    const wrapper = mount(HoleSurveyTable, {
      props: { rows: [saved], errors: { r1: { depth: 'Another station has this depth' } } },
      ...withPrimeVue,
    })
    expect(wrapper.get('[data-testid="survey-row-0"]').classes()).toContain('invalid')
    expect(wrapper.get('[role="alert"]').text()).toBe('Row 1: Another station has this depth.')
  })
})

describe('rowErrors()', () => {
  it('accepts a complete row in range', () => {
    expect(rowErrors(saved, [saved, draft])).toEqual({})
  })

  it('names duplicate depths and out-of-range angles', () => {
    const twin = { ...draft, key: 'r3', depth: 0, azimuth: 360, plunge: 91 }
    expect(rowErrors(twin, [saved, twin])).toEqual({
      depth: 'Another station has this depth',
      azimuth: 'Azimuth from 0 to below 360',
      plunge: 'Plunge from -90 to 90 (down +)',
    })
  })

  it('requires depth, azimuth and plunge', () => {
    const blank = { ...draft, depth: null, azimuth: null, plunge: Number.NaN }
    expect(Object.keys(rowErrors(blank, [blank]))).toEqual(['depth', 'azimuth', 'plunge'])
  })
})

describe('rowFromStation()', () => {
  it('edits the azimuth as entered and keeps the corrected one apart', () => {
    const row = rowFromStation({
      id: 7,
      holeId: 3,
      depth: 12,
      azimuth: 191.2,
      plunge: 61,
      azimuthReference: 'magnetic',
      azimuthEntered: 189,
      declinationApplied: 2.2,
      convergenceApplied: 0,
      plungeConvention: 'plunge-down',
      method: 'multishot',
      surveyedOn: null,
      version: 1,
    })
    expect(row).toMatchObject({
      stationId: 7,
      azimuth: 189,
      trueAzimuth: 191.2,
      depth: 12,
      convergenceApplied: 0,
    })
  })
})
