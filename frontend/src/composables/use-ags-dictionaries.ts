import { ref } from 'vue'
import {
  listAgsDictionaries,
  loadAgsDictionary,
  removeAgsDictionary,
  type AgsDictionary,
} from '../api/ags'
import { describeError } from '../logic/format'

/** The loaded AGS4 standard dictionaries: the list anyone sees, and an administrator's changes. */
export function useAgsDictionaries() {
  const dictionaries = ref<AgsDictionary[]>([])
  const busy = ref(false)
  const error = ref<string | null>(null)
  /** What the last change did, for the page to say. */
  const done = ref<string | null>(null)

  async function refresh() {
    try {
      dictionaries.value = await listAgsDictionaries()
    } catch (err: unknown) {
      error.value = describeError(err, 'The loaded dictionaries could not be listed.')
    }
  }

  /** Runs one change; true when it went through (the list is read again either way). */
  async function change(run: () => Promise<string>): Promise<boolean> {
    busy.value = true
    error.value = null
    done.value = null
    try {
      done.value = await run()
      return true
    } catch (err: unknown) {
      error.value = describeError(err, 'The dictionary could not be changed.')
      return false
    } finally {
      await refresh()
      busy.value = false
    }
  }

  const load = (file: File, edition?: string) =>
    change(async () => {
      const had = dictionaries.value.map((d) => d.edition)
      const row = await loadAgsDictionary(file, edition)
      const replacing = had.includes(row.edition)
      const what = `${row.groupCount} groups, ${row.headingCount} headings`
      return `AGS ${row.edition} dictionary ${replacing ? 'replaced' : 'loaded'} from ${row.fileName} (${what}).`
    })

  const remove = (edition: string) =>
    change(async () => {
      await removeAgsDictionary(edition)
      return `AGS ${edition} dictionary removed: files of it are checked against the built-in groups.`
    })

  return { dictionaries, busy, error, done, refresh, load, remove }
}
