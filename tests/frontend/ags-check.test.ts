import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import PrimeVue from 'primevue/config'
import ConfirmationService from 'primevue/confirmationservice'
import AgsCheckResult from '../../frontend/src/components/ags/AgsCheckResult.vue'
import AgsCheckDictionaries from '../../frontend/src/components/ags/AgsCheckDictionaries.vue'
import type { AgsDictionary, AgsFileCheck } from '../../frontend/src/api/ags'

const plugins = {
  global: { plugins: [[PrimeVue, { theme: 'none' }], ConfirmationService] as never[] },
}

const check = (over: Partial<AgsFileCheck> = {}): AgsFileCheck => ({
  fileName: 'gsq-site-investigation.ags',
  bytes: 5210,
  edition: '4.1.1',
  dictionary: { edition: '4.1.1', source: 'built-in' },
  errors: 0,
  warnings: 0,
  byRule: [],
  findings: [],
  truncated: false,
  unchecked: [
    {
      rule: '9',
      group: 'GEOL',
      line: 59,
      message:
        'Rule 9: group GEOL is not in the groups Downdip knows and the 4.1.1 standard dictionary is not loaded: ask an administrator to load it.',
    },
    {
      rule: '9',
      group: 'SAMP',
      line: 67,
      message: 'Rule 9: group SAMP is not in the groups Downdip knows and …',
    },
  ],
  notes: [],
  groups: [{ name: 'PROJ', line: 1, rows: 1 }],
  ...over,
})

const dictionary: AgsDictionary = {
  edition: '4.1.1',
  fileName: 'gsq-test-dictionary-4-1-1.ags',
  fileSize: 20480,
  sha256: 'ab'.repeat(32),
  groupCount: 28,
  headingCount: 220,
  loadedAt: '2026-12-10T09:00:00.000Z',
  loadedBy: 1,
  loadedByName: 'Ada Admin',
}

describe('AgsCheckResult', () => {
  it('no error but groups not checkable: the verdict is partial, says why, and lists them by line', () => {
    const w = mount(AgsCheckResult, {
      ...plugins,
      props: { result: check(), shown: [], rule: null },
    })
    const verdict = w.get('[data-testid="ags-verdict"]')
    expect(verdict.attributes('data-verdict')).toBe('partial')
    expect(verdict.text()).toContain('2 groups could not be checked in full')
    expect(w.get('[data-testid="ags-dictionary-used"]').text()).toContain(
      'Checked against the groups Downdip writes (as AGS 4.1.1 defines them)',
    )
    const rows = w.findAll('[data-testid="ags-unchecked"] tbody tr')
    expect(rows.map((r) => r.attributes('data-group'))).toEqual(['GEOL', 'SAMP'])
    expect(rows[0].text()).toContain('59')
    expect(rows[0].text()).toContain('group GEOL is not in the groups Downdip knows')
    expect(rows[0].text()).not.toContain('Rule 9:')
  })

  it('a loaded dictionary and nothing unchecked: passes, and says which dictionary', () => {
    const w = mount(AgsCheckResult, {
      ...plugins,
      props: {
        result: check({ unchecked: [], dictionary: { edition: '4.1.1', source: 'loaded' } }),
        shown: [],
        rule: null,
      },
    })
    expect(w.get('[data-testid="ags-verdict"]').attributes('data-verdict')).toBe('passes')
    expect(w.get('[data-testid="ags-dictionary-used"]').text()).toBe(
      'Checked against the loaded AGS 4.1.1 standard dictionary.',
    )
    expect(w.find('[data-testid="ags-unchecked"]').exists()).toBe(false)
  })
})

describe('AgsCheckDictionaries', () => {
  it('lists the loaded editions; a non-admin gets no load or remove control', () => {
    const w = mount(AgsCheckDictionaries, {
      ...plugins,
      props: { dictionaries: [dictionary], isAdmin: false, busy: false, error: null, done: null },
    })
    const row = w.get('[data-testid="ags-dictionaries"] tbody tr')
    expect(row.attributes('data-edition')).toBe('4.1.1')
    expect(row.text()).toContain('AGS 4.1.1')
    expect(row.text()).toContain('Ada Admin')
    expect(w.find('[data-testid="ags-dictionary-load"]').exists()).toBe(false)
    expect(w.find('[data-testid="ags-dictionary-remove-4.1.1"]').exists()).toBe(false)
  })

  it('an admin picks a file: load is emitted with the edition typed, or none', async () => {
    const w = mount(AgsCheckDictionaries, {
      ...plugins,
      props: { dictionaries: [], isAdmin: true, busy: false, error: null, done: null },
    })
    expect(w.get('[data-testid="ags-dictionaries-none"]').text()).toContain('None loaded')
    const input = w.get('[data-testid="ags-dictionary-file"]')
    const file = new File(['"GROUP","DICT"'], 'dictionary.ags', { type: 'text/plain' })
    Object.defineProperty(input.element, 'files', { value: [file], configurable: true })
    await input.trigger('change')
    await w.get('#ags-dictionary-edition').setValue('4.0.4')
    await input.trigger('change')
    expect(w.emitted('load')).toEqual([
      [file, undefined],
      [file, '4.0.4'],
    ])
  })
})
