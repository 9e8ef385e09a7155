import { mulberry32 } from '../../../orient/index'

/** A stable seed from a name (FNV-1a), so each demo hole draws its own sequence. */
export function seedOf(name: string): number {
  let h = 0x811c9dc5
  for (let i = 0; i < name.length; i++) h = Math.imul(h ^ name.charCodeAt(i), 0x01000193)
  return h >>> 0
}

/**
 * The demo's draws for one name: orient's seeded generator (the one seeded clustering uses), so
 * the demo is the same on every machine and every run.
 */
export const demoRandom = (name: string): (() => number) => mulberry32(seedOf(name))
