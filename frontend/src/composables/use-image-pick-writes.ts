import { computed, ref } from 'vue'
import {
  createImagePick,
  deleteImagePick,
  listImagePicks,
  updateImagePick,
  type ImagePickRecord,
  type TracePoint,
} from '../api/images'
import { fitSinusoid } from '../../../orient/index'
import { describeError } from '../logic/format'
import { isStaleVersion } from '../logic/refusals'
import * as pr from '../logic/image-picking/pick-rows'

export type PickFields = { points?: TracePoint[]; type?: string; confidence?: string | null }
type NewPick = Parameters<typeof pr.newPending>[1]

const byDepth = (a: ImagePickRecord, b: ImagePickRecord) =>
  a.centreDepth - b.centreDepth || a.structureId - b.structureId

/**
 * The picks of one image as stored and the writes on them: new picks are shown at once and sent
 * under their own Idempotency-Key (a failed one stays, points and all, until retried or taken back
 * to the wall); changes carry the version (409 reloads and says so); a delete can be undone until
 * the next write. `onChanged` is told after every stored change.
 */
export function useImagePickWrites(
  projectId: () => string,
  holeId: () => string,
  imageId: () => number,
  onChanged: () => void,
) {
  const picks = ref<ImagePickRecord[]>([])
  const pending = ref<pr.PendingPick[]>([])
  /** Per pick (table key): why the last write on it was refused. */
  const notes = ref<Record<string, string>>({})
  /** The pick deleted last, offered back until the next write. */
  const deleted = ref<ImagePickRecord | null>(null)
  const loading = ref(false)
  const error = ref<string | null>(null)
  /** A pick that was pending under this table key is stored now under that one. */
  const renamed = ref<{ from: string; to: string } | null>(null)
  const rows = computed(() => pr.pickRows(picks.value, pending.value))
  let lastPending = 0
  /** Counts local writes: a list fetched while one landed is stale and fetched again. */
  let writes = 0

  const record = (id: number) => picks.value.find((p) => p.structureId === id)
  function put(row: ImagePickRecord) {
    writes++
    picks.value = [...picks.value.filter((p) => p.structureId !== row.structureId), row].sort(
      byDepth,
    )
  }
  function note(key: string, text: string | null) {
    const { [key]: _, ...rest } = notes.value
    notes.value = text ? { ...rest, [key]: text } : rest
  }

  async function load(): Promise<void> {
    loading.value = true
    const before = writes
    try {
      const fetched = await listImagePicks(projectId(), holeId(), imageId())
      if (writes !== before) return load()
      picks.value = [...fetched].sort(byDepth)
      error.value = null
    } catch (err: unknown) {
      error.value = describeError(err, 'The picks could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  /** Any new write ends the offer to bring back the last deleted pick. */
  const settle = () => void (deleted.value = null)

  function create(fields: NewPick) {
    settle()
    const key = ++lastPending
    pending.value = [...pending.value, pr.newPending(key, fields)]
    void send(key)
    return pr.pendingKey(key)
  }

  const setPending = (key: number, patch: Partial<pr.PendingPick>) =>
    (pending.value = pending.value.map((p) => (p.key === key ? { ...p, ...patch } : p)))

  async function send(key: number) {
    const item = pending.value.find((p) => p.key === key)
    if (!item) return
    setPending(key, { status: 'saving', message: null })
    try {
      const saved = await createImagePick(
        projectId(),
        holeId(),
        imageId(),
        pr.pendingBody(item),
        item.idempotencyKey,
      )
      pending.value = pending.value.filter((p) => p.key !== key)
      renamed.value = { from: pr.pendingKey(key), to: pr.pickKey(saved.structureId) }
      put(saved)
      onChanged()
    } catch (err: unknown) {
      setPending(key, { status: 'failed', message: describeError(err, 'The pick was not saved.') })
    }
  }

  /** Sends a failed pick again under its own key: it can never be stored twice. */
  const retry = (key: number) => void send(key)

  /** Takes a failed pick off the list and hands back its points (to draw it again). */
  function takeBack(key: number): pr.PendingPick | null {
    const item = pending.value.find((p) => p.key === key && p.status === 'failed')
    if (!item) return null
    pending.value = pending.value.filter((p) => p.key !== key)
    return item
  }

  async function update(structureId: number, fields: PickFields): Promise<boolean> {
    settle()
    const row = record(structureId)
    if (!row) return false
    const key = pr.pickKey(structureId)
    note(key, null)
    try {
      const body = { ...fields, version: row.structure.version }
      put(await updateImagePick(projectId(), holeId(), imageId(), structureId, body))
      onChanged()
      return true
    } catch (err: unknown) {
      refused(key, err, 'The pick was not changed.')
      return false
    }
  }

  function refused(key: string, err: unknown, fallback: string) {
    if (!isStaleVersion(err)) return note(key, describeError(err, fallback))
    note(key, 'Someone changed this pick since it was loaded: it has been reloaded, try again.')
    void load()
  }

  async function remove(structureId: number): Promise<boolean> {
    const row = record(structureId)
    if (!row) return false
    settle()
    const key = pr.pickKey(structureId)
    note(key, null)
    try {
      await deleteImagePick(projectId(), holeId(), imageId(), structureId, row.structure.version)
      writes++
      picks.value = picks.value.filter((p) => p.structureId !== structureId)
      deleted.value = row
      onChanged()
      return true
    } catch (err: unknown) {
      refused(key, err, 'The pick was not deleted.')
      return false
    }
  }

  /** Brings the last deleted pick back: the same points, type and rating, as a new structure. */
  function undoDelete(): string | null {
    const row = deleted.value
    const fit = row && fitSinusoid(row.points)
    if (!row || !fit) return null
    const { type, confidence, comment } = row.structure
    return create({ points: row.points, type, confidence, comment, suggested: row.suggested, fit })
  }

  return {
    picks,
    pending,
    notes,
    deleted,
    loading,
    error,
    renamed,
    rows,
    load,
    create,
    retry,
    takeBack,
    update,
    remove,
    undoDelete,
    settle,
  }
}

export type ImagePickWrites = ReturnType<typeof useImagePickWrites>
