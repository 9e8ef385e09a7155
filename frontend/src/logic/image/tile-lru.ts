// A least-recently-used store bounded by bytes, for image tiles and their coloured bitmaps.

export interface Sized {
  /** What the entry holds in memory (bytes), counted against the budget. */
  bytes: number
}

/**
 * Entries kept while their total stays within `budget` bytes: reading one (get) makes it the most
 * recent, adding past the budget drops the least recent first — never the one just added, so a
 * single entry larger than the budget still works.
 */
export class TileLru<T extends Sized> {
  private map = new Map<string, T>()
  private total = 0

  constructor(
    readonly budget: number,
    private readonly onEvict: (key: string, value: T) => void = () => {},
  ) {}

  get size() {
    return this.map.size
  }

  get bytes() {
    return this.total
  }

  /** The entry, now the most recently used. */
  get(key: string): T | undefined {
    const v = this.map.get(key)
    if (v === undefined) return undefined
    this.map.delete(key)
    this.map.set(key, v)
    return v
  }

  /** The entry, without counting as a use. */
  peek(key: string): T | undefined {
    return this.map.get(key)
  }

  has(key: string) {
    return this.map.has(key)
  }

  set(key: string, value: T): void {
    const old = this.map.get(key)
    if (old) {
      this.total -= old.bytes
      this.map.delete(key)
    }
    this.map.set(key, value)
    this.total += value.bytes
    this.trim(key)
  }

  /** After an entry's size changed in place (a bitmap added or dropped). */
  resize(key: string, bytes: number): void {
    const v = this.map.get(key)
    if (!v) return
    this.total += bytes - v.bytes
    v.bytes = bytes
    this.trim(key)
  }

  delete(key: string): void {
    const v = this.map.get(key)
    if (!v) return
    this.map.delete(key)
    this.total -= v.bytes
    this.onEvict(key, v)
  }

  clear(): void {
    for (const [k, v] of this.map) this.onEvict(k, v)
    this.map.clear()
    this.total = 0
  }

  values(): IterableIterator<T> {
    return this.map.values()
  }

  private trim(keep: string) {
    for (const [k] of this.map) {
      if (this.total <= this.budget) break
      if (k !== keep) this.delete(k)
    }
  }
}
