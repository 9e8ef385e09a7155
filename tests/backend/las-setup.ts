import { afterAll, beforeAll } from 'vitest'
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { holes } from '../../schema/index'
import { clientFor, createFixture, holeValues, type Client, type Fixture } from './fixture'

const dir = fileURLToPath(new URL('../../testdata/las/', import.meta.url))
export const lasBytes = (name: string) => readFileSync(dir + name)

/**
 * The LAS route tests' world: the fixture, a hole named `holeName` (the well name the files carry)
 * and a second hole, and signed-in logger, viewer and outsider clients. Registers its own hooks.
 */
export function lasSuite(holeName: string) {
  const ctx = {
    fx: undefined as unknown as Fixture,
    logger: undefined as unknown as Client,
    viewer: undefined as unknown as Client,
    outsider: undefined as unknown as Client,
    holeId: 0,
    otherHoleId: 0,
  }
  beforeAll(async () => {
    ctx.fx = await createFixture()
    const rows = await ctx.fx.db
      .insert(holes)
      .values([holeValues(ctx.fx.projectId, holeName), holeValues(ctx.fx.projectId, 'GSQ-BH09')])
      .returning()
    ;[ctx.holeId, ctx.otherHoleId] = rows.map((r) => r.id)
    ctx.logger = await clientFor(ctx.fx.app, 'logger')
    ctx.viewer = await clientFor(ctx.fx.app, 'viewer')
    ctx.outsider = await clientFor(ctx.fx.app, 'outsider')
  })
  afterAll(() => ctx.fx.close())
  return ctx
}
