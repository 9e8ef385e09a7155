import { computed, ref } from 'vue'
import { checkAgsFile, type AgsFileCheck } from '../api/ags'
import { describeError } from '../logic/format'

/** The AGS4 check page: the chosen file, its result, a rule filter, and the error of a call. */
export function useAgsCheck() {
  const result = ref<AgsFileCheck | null>(null)
  const fileName = ref('')
  const busy = ref(false)
  const error = ref<string | null>(null)
  const rule = ref<string | null>(null)
  /** Each call numbered: a slow answer for an earlier file never replaces a later one. */
  let call = 0
  let last: File | null = null

  async function check(file: File) {
    const mine = ++call
    last = file
    busy.value = true
    error.value = null
    fileName.value = file.name
    rule.value = null
    try {
      const answer = await checkAgsFile(file)
      if (mine === call) result.value = answer
    } catch (err: unknown) {
      if (mine === call) {
        result.value = null
        error.value = describeError(err, 'The file could not be checked.')
      }
    } finally {
      if (mine === call) busy.value = false
    }
  }

  const shown = computed(() =>
    (result.value?.findings ?? []).filter((f) => rule.value === null || f.rule === rule.value),
  )
  const toggleRule = (r: string) => {
    rule.value = rule.value === r ? null : r
  }

  /** The last file again: after a dictionary was loaded or removed, its answer may change. */
  const recheck = () => (last ? check(last) : Promise.resolve())

  return { result, fileName, busy, error, rule, shown, check, recheck, toggleRule }
}
