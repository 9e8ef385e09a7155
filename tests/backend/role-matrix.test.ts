import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { readFileSync } from 'node:fs'
import request from 'supertest'
import {
  adjustments,
  coreRuns,
  imageFiles,
  imagePicks,
  images,
  imageTiles,
  logCurves,
  domains,
  holes,
  imports,
  intervals,
  memberships,
  projects,
  structures,
  structureSets,
  surveyStations,
  users,
} from '../../schema/index'
import {
  actors,
  clientFor,
  createFixture,
  holeValues,
  PASSWORD,
  type Actor,
  type Client,
  type Fixture,
} from './fixture'
import { encodeTile } from '../../backend/src/services/image-rows'
import { DEFAULT_ERROR_MODEL } from '../../orient/index'

type Need =
  'public' | 'signed-in' | 'admin' | 'project-admin' | 'viewer' | 'logger' | 'engineer' | 'lead'
interface RouteCase {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete'
  route: string
  need: Need
  ok: number
  /** Makes a fresh target for each caller: the path to call and the body to send. */
  prepare: (fx: Fixture) => Promise<{ path: string; body?: object }>
}

const rank: Record<string, number> = { viewer: 0, logger: 1, engineer: 2, lead: 3 }
let n = 0
const unique = () => ++n

/** The status each caller must get: 401 signed out, 404 outside the project, 403 too low a role. */
function expected(c: RouteCase, who: Actor | 'anonymous'): number {
  if (c.need === 'public') return c.ok
  if (who === 'anonymous') return 401
  if (c.need === 'signed-in') return c.ok
  if (c.need === 'admin') return who === 'admin' ? c.ok : 403
  // an administrator's route under a project: outsiders still learn nothing of the project
  if (c.need === 'project-admin') return who === 'admin' ? c.ok : who === 'outsider' ? 404 : 403
  if (who === 'admin') return c.ok
  if (who === 'outsider') return 404
  return rank[who] >= rank[c.need] ? c.ok : 403
}

const P = (fx: Fixture) => `/api/projects/${fx.projectId}`
const H = (fx: Fixture) => `${P(fx)}/holes/${fx.holeId}`
const freshUser = async (fx: Fixture) => {
  const [u] = await fx.db
    .insert(users)
    .values({ email: `fresh${unique()}@test.example`, name: 'Fresh', passwordHash: 'x' })
    .returning()
  return u
}
const freshMember = async (fx: Fixture) => {
  const u = await freshUser(fx)
  await fx.db.insert(memberships).values({ projectId: fx.projectId, userId: u.id, role: 'viewer' })
  return u
}
const freshStation = async (fx: Fixture) => {
  const [s] = await fx.db
    .insert(surveyStations)
    .values({
      holeId: fx.holeId,
      depth: 1000 + unique(),
      azimuth: 10,
      azimuthEntered: 10,
      plunge: 60,
    })
    .returning()
  return s
}
const freshRun = async (fx: Fixture) => {
  const from = 2000 + 10 * unique()
  const [r] = await fx.db
    .insert(coreRuns)
    .values({
      holeId: fx.holeId,
      fromDepth: from,
      toDepth: from + 3,
      recovered: 3,
      solid: 2.5,
      rqdLength: 2,
    })
    .returning()
  return r
}
const freshStructure = async (fx: Fixture) => {
  const [s] = await fx.db
    .insert(structures)
    .values({ holeId: fx.holeId, depth: 5 + unique() / 100, type: 'joint', alpha: 40, beta: 10 })
    .returning()
  return s
}
const freshImport = async (fx: Fixture) => {
  const [i] = await fx.db
    .insert(imports)
    .values({
      projectId: fx.projectId,
      holeId: fx.holeId,
      kind: 'structures',
      fileName: 'one.csv',
      file: Buffer.from(`depth,type,alpha,beta\n${1 + unique() / 1000},joint,45,90\n`),
      options: {
        mapping: { depth: 'depth', type: 'type', alpha: 'alpha', beta: 'beta' },
        options: {},
      },
      rowCount: 1,
    })
    .returning()
  return i
}
/** A committed structures import that added no rows: undoing it touches no interval. */
const freshCommitted = async (fx: Fixture) => {
  const i = await freshImport(fx)
  await fx.db
    .update(imports)
    .set({ status: 'committed', committedAt: new Date() })
    .where(eq(imports.id, i.id))
  return i
}
const freshInterval = async (fx: Fixture) => {
  const from = 10 * unique()
  const [i] = await fx.db
    .insert(intervals)
    .values({
      holeId: fx.holeId,
      name: `I${from}`,
      fromDepth: from,
      toDepth: from + 5,
      faceDip: 70,
      faceDipDirection: 190,
      frictionDeg: 30,
    })
    .returning()
  return i
}
const freshSet = async (fx: Fixture) => {
  const i = await freshInterval(fx)
  const [set] = await fx.db
    .insert(structureSets)
    .values({ intervalId: i.id, name: 'S', centreTrend: 10, centrePlunge: 40, coneAngle: 20 })
    .returning()
  return { interval: i, set }
}
const lasFile = (name: string) =>
  readFileSync(new URL(`../../testdata/las/${name}`, import.meta.url))
const freshLas = async (fx: Fixture, name = 'gsq-bh02-plain.las') => {
  const [i] = await fx.db
    .insert(imports)
    .values({
      projectId: fx.projectId,
      holeId: fx.holeId,
      kind: 'las',
      fileName: name,
      file: lasFile(name),
      options: {},
    })
    .returning()
  return i
}
const freshCurve = async (fx: Fixture) => {
  const [c] = await fx.db
    .insert(logCurves)
    .values({
      holeId: fx.holeId,
      mnemonic: 'GR',
      sourceFile: 'x.las',
      depths: [1, 2],
      values: [10, 20],
      minDepth: 1,
      maxDepth: 2,
    })
    .returning()
  return c
}
/** A ready 8-bit image of 4 rows × 8 samples (one tile, one file chunk) far down the hole. */
const freshImage = async (fx: Fixture) => {
  const top = 3000 + unique()
  const [img] = await fx.db
    .insert(images)
    .values({
      holeId: fx.holeId,
      kind: 'amplitude',
      source: 'raster',
      name: 'strip.png',
      fileName: 'strip.png',
      mediaType: 'image/png',
      fileSize: 4,
      sha256: `sha-${top}`,
      topDepth: top,
      bottomDepth: top + 0.02,
      width: 8,
      height: 4,
      channels: 1,
      sampleBits: 8,
      azimuthReference: 'highside',
      diameterMm: 96,
      diameterSource: 'entered',
      levels: 1,
      status: 'ready',
      progress: 100,
    })
    .returning()
  await fx.db
    .insert(imageTiles)
    .values({ imageId: img.id, level: 0, tile: 0, rows: 4, bytes: encodeTile(new Uint8Array(32)) })
  await fx.db.insert(imageFiles).values({ imageId: img.id, seq: 0, bytes: Buffer.from('png!') })
  return img
}
const pointsOn = (top: number) =>
  [0, 90, 180, 270].map((azimuth, k) => ({ depth: top + 0.005 + (k % 2) * 0.005, azimuth }))
/** A pick on a fresh image: the structure row and its raw pick. */
const freshImagePick = async (fx: Fixture) => {
  const img = await freshImage(fx)
  const [s] = await fx.db
    .insert(structures)
    .values({
      holeId: fx.holeId,
      depth: img.topDepth + 0.01,
      type: 'joint',
      source: 'image',
      pickAmplitude: 10,
      pickDiameter: 96,
      pickTroughAzimuth: 0,
      pickReference: 'highside',
      pickAzimuthReference: 'highside',
    })
    .returning()
  await fx.db.insert(imagePicks).values({
    structureId: s.id,
    imageId: img.id,
    points: pointsOn(img.topDepth),
    centreDepth: img.topDepth + 0.01,
    heightMm: 10,
    troughAzimuth: 0,
    diameterMm: 96,
    azimuthReference: 'highside',
    rmsMm: 0,
  })
  return { img, s }
}
const IMG = (fx: Fixture, id: number) => `${H(fx)}/images/${id}`
const I = (fx: Fixture, id: number) => `${H(fx)}/intervals/${id}`
const station = () => ({ depth: 500 + unique(), azimuth: 12, plunge: 58, azimuthReference: 'true' })

const cases: RouteCase[] = [
  {
    method: 'get',
    route: '/api/health',
    need: 'public',
    ok: 200,
    prepare: async () => ({ path: '/api/health' }),
  },
  {
    method: 'get',
    route: '/api/auth/me',
    need: 'signed-in',
    ok: 200,
    prepare: async () => ({ path: '/api/auth/me' }),
  },
  {
    method: 'get',
    route: '/api/projects',
    need: 'signed-in',
    ok: 200,
    prepare: async () => ({ path: '/api/projects' }),
  },
  {
    method: 'post',
    route: '/api/projects',
    need: 'admin',
    ok: 201,
    prepare: async (fx) => ({
      path: '/api/projects',
      body: { code: `NEW${unique()}`, name: 'New', crsEpsg: 32630, leadUserId: fx.userIds.lead },
    }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: P(fx) }),
  },
  {
    method: 'patch',
    route: '/api/projects/:projectId',
    need: 'lead',
    ok: 200,
    prepare: async (fx) => {
      const [p] = await fx.db.select().from(projects).where(eq(projects.id, fx.projectId))
      return { path: P(fx), body: { version: p.version, name: `Renamed ${unique()}` } }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/members',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${P(fx)}/members` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/members',
    need: 'lead',
    ok: 202,
    prepare: async (fx) => ({
      path: `${P(fx)}/members`,
      body: { email: (await freshUser(fx)).email, role: 'viewer' },
    }),
  },
  {
    method: 'patch',
    route: '/api/projects/:projectId/members/:userId',
    need: 'lead',
    ok: 200,
    prepare: async (fx) => ({
      path: `${P(fx)}/members/${(await freshMember(fx)).id}`,
      body: { role: 'logger' },
    }),
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/members/:userId',
    need: 'lead',
    ok: 204,
    prepare: async (fx) => ({ path: `${P(fx)}/members/${(await freshMember(fx)).id}` }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${P(fx)}/holes` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes',
    need: 'logger',
    ok: 201,
    prepare: async (fx) => {
      const { projectId: _p, ...body } = holeValues(fx.projectId, `NEW-${unique()}`)
      return { path: `${P(fx)}/holes`, body }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: H(fx) }),
  },
  {
    method: 'patch',
    route: '/api/projects/:projectId/holes/:holeId',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => {
      const [h] = await fx.db.select().from(holes).where(eq(holes.id, fx.holeId))
      return { path: H(fx), body: { version: h.version, coreSize: `HQ${unique()}` } }
    },
  },
  {
    method: 'get',
    route: '/api/projects/bin',
    need: 'signed-in',
    ok: 200,
    prepare: async () => ({ path: '/api/projects/bin' }),
  },
  {
    method: 'delete',
    route: '/api/projects/bin/:projectId',
    need: 'admin',
    ok: 204,
    prepare: async (fx) => {
      const [p] = await fx.db
        .insert(projects)
        .values({ code: `BIN${unique()}`, name: 'Bin', crsEpsg: 32630, deletedAt: new Date() })
        .returning()
      return { path: `/api/projects/bin/${p.id}` }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/deleted',
    need: 'lead',
    ok: 200,
    prepare: async (fx) => ({ path: `${P(fx)}/holes/deleted` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/restore',
    need: 'lead',
    ok: 200,
    prepare: async (fx) => {
      const [h] = await fx.db
        .insert(holes)
        .values({ ...holeValues(fx.projectId, `BIN-${unique()}`), deletedAt: new Date() })
        .returning()
      return { path: `${P(fx)}/holes/${h.id}/restore` }
    },
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/holes/:holeId/purge',
    need: 'project-admin',
    ok: 204,
    prepare: async (fx) => {
      const [h] = await fx.db
        .insert(holes)
        .values({ ...holeValues(fx.projectId, `BIN-${unique()}`), deletedAt: new Date() })
        .returning()
      return { path: `${P(fx)}/holes/${h.id}/purge` }
    },
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/holes/:holeId',
    need: 'lead',
    ok: 204,
    prepare: async (fx) => {
      const [h] = await fx.db
        .insert(holes)
        .values(holeValues(fx.projectId, `DEL-${unique()}`))
        .returning()
      return { path: `${P(fx)}/holes/${h.id}` }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/survey',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/survey` }),
  },
  {
    method: 'put',
    route: '/api/projects/:projectId/holes/:holeId/survey',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => ({
      path: `${H(fx)}/survey`,
      body: { stations: [station(), station()] },
    }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/survey',
    need: 'logger',
    ok: 201,
    prepare: async (fx) => ({ path: `${H(fx)}/survey`, body: station() }),
  },
  {
    method: 'patch',
    route: '/api/projects/:projectId/holes/:holeId/survey/:stationId',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => {
      const s = await freshStation(fx)
      return { path: `${H(fx)}/survey/${s.id}`, body: { version: s.version, plunge: 61 } }
    },
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/holes/:holeId/survey/:stationId',
    need: 'logger',
    ok: 204,
    prepare: async (fx) => ({ path: `${H(fx)}/survey/${(await freshStation(fx)).id}` }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/runs',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/runs` }),
  },
  {
    method: 'put',
    route: '/api/projects/:projectId/holes/:holeId/runs',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => ({
      path: `${H(fx)}/runs`,
      body: { runs: [{ fromDepth: 0, toDepth: 3, recovered: 3, solid: 2, rqdLength: 1.5 }] },
    }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/runs',
    need: 'logger',
    ok: 201,
    prepare: async (fx) => {
      const from = 3000 + 10 * unique()
      return {
        path: `${H(fx)}/runs`,
        body: { fromDepth: from, toDepth: from + 3, recovered: 3, solid: 2, rqdLength: 1 },
      }
    },
  },
  {
    method: 'patch',
    route: '/api/projects/:projectId/holes/:holeId/runs/:runId',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => {
      const r = await freshRun(fx)
      return { path: `${H(fx)}/runs/${r.id}`, body: { version: r.version, fractureCount: 4 } }
    },
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/holes/:holeId/runs/:runId',
    need: 'logger',
    ok: 204,
    prepare: async (fx) => ({ path: `${H(fx)}/runs/${(await freshRun(fx)).id}` }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/structures',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/structures` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/structures',
    need: 'logger',
    ok: 201,
    prepare: async (fx) => ({
      path: `${H(fx)}/structures`,
      body: { depth: 10 + unique() / 100, type: 'joint', alpha: 50, beta: 120 },
    }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/structures/:structureId',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/structures/${(await freshStructure(fx)).id}` }),
  },
  {
    method: 'patch',
    route: '/api/projects/:projectId/holes/:holeId/structures/:structureId',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => {
      const st = await freshStructure(fx)
      return {
        path: `${H(fx)}/structures/${st.id}`,
        body: { version: st.version, comment: 'seen' },
      }
    },
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/holes/:holeId/structures/:structureId',
    need: 'logger',
    ok: 204,
    prepare: async (fx) => {
      const st = await freshStructure(fx)
      return { path: `${H(fx)}/structures/${st.id}?version=${st.version}` }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/imports',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/imports` }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/imports/:importId',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/imports/${(await freshImport(fx)).id}` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/imports/:importId/commit',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/imports/${(await freshImport(fx)).id}/commit` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/imports/:importId/undo',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/imports/${(await freshCommitted(fx)).id}/undo` }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/domains',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${P(fx)}/domains` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/domains',
    need: 'engineer',
    ok: 201,
    prepare: async (fx) => ({ path: `${P(fx)}/domains`, body: { name: `Domain ${unique()}` } }),
  },
  {
    method: 'patch',
    route: '/api/projects/:projectId/domains/:domainId',
    need: 'engineer',
    ok: 200,
    prepare: async (fx) => {
      const [d] = await fx.db
        .insert(domains)
        .values({ projectId: fx.projectId, name: `D${unique()}` })
        .returning()
      return { path: `${P(fx)}/domains/${d.id}`, body: { description: 'edited' } }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/intervals',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/intervals` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/intervals',
    need: 'engineer',
    ok: 201,
    prepare: async (fx) => {
      const from = 10 * unique()
      return {
        path: `${H(fx)}/intervals`,
        body: { name: `N${from}`, fromDepth: from, toDepth: from + 5 },
      }
    },
  },
  {
    method: 'patch',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId',
    need: 'engineer',
    ok: 200,
    prepare: async (fx) => {
      const i = await freshInterval(fx)
      return { path: I(fx, i.id), body: { version: i.version, name: 'renamed' } }
    },
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId',
    need: 'engineer',
    ok: 204,
    prepare: async (fx) => {
      const i = await freshInterval(fx)
      return { path: `${I(fx, i.id)}?version=${i.version}` }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/analysis',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${I(fx, (await freshInterval(fx)).id)}/analysis` }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/sets/suggest',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${I(fx, (await freshInterval(fx)).id)}/sets/suggest` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/sets',
    need: 'engineer',
    ok: 201,
    prepare: async (fx) => ({
      path: `${I(fx, (await freshInterval(fx)).id)}/sets`,
      body: { name: 'J1', centreTrend: 10, centrePlunge: 40, coneAngle: 15 },
    }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/sets/cluster',
    need: 'engineer',
    ok: 200,
    prepare: async (fx) => {
      const i = await freshInterval(fx)
      await fx.db.insert(structures).values(
        [0, 1, 2].map((k) => ({
          holeId: fx.holeId,
          depth: i.fromDepth + k,
          type: 'joint' as const,
          alpha: 40,
          beta: 10,
          poleTrend: 10 + k,
          polePlunge: 40,
          dip: 50,
          dipDirection: 190 + k,
        })),
      )
      return { path: `${I(fx, i.id)}/sets/cluster`, body: { k: 1 } }
    },
  },
  {
    method: 'patch',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/sets/:setId',
    need: 'engineer',
    ok: 200,
    prepare: async (fx) => {
      const { interval, set } = await freshSet(fx)
      return {
        path: `${I(fx, interval.id)}/sets/${set.id}`,
        body: { version: set.version, coneAngle: 25 },
      }
    },
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/sets/:setId',
    need: 'engineer',
    ok: 204,
    prepare: async (fx) => {
      const { interval, set } = await freshSet(fx)
      return { path: `${I(fx, interval.id)}/sets/${set.id}` }
    },
  },
  {
    method: 'put',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/sets/:setId/members',
    need: 'engineer',
    ok: 200,
    prepare: async (fx) => {
      const { interval, set } = await freshSet(fx)
      return { path: `${I(fx, interval.id)}/sets/${set.id}/members`, body: { structureIds: [] } }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/logs',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/logs` }),
  },
  // multipart routes: past the role check, a request without a file is refused as 400
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/logs',
    need: 'logger',
    ok: 400,
    prepare: async (fx) => ({ path: `${H(fx)}/logs` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/imports',
    need: 'logger',
    ok: 400,
    prepare: async (fx) => ({ path: `${H(fx)}/imports` }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/logs/:curveId',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/logs/${(await freshCurve(fx)).id}` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/logs/imports/:importId/commit',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => ({
      path: `${H(fx)}/logs/imports/${(await freshLas(fx)).id}/commit`,
      body: {},
    }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/logs/imports/:importId/file',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/logs/imports/${(await freshLas(fx)).id}/file` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/logs/imports/:importId/survey-from-deviation',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => ({
      path: `${H(fx)}/logs/imports/${(await freshLas(fx, 'gsq-bh03-feet-deviation.las')).id}/survey-from-deviation`,
      body: {},
    }),
  },
  // televiewer images
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/images',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/images` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/images',
    need: 'logger',
    ok: 400,
    prepare: async (fx) => ({ path: `${H(fx)}/images` }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/images/:imageId',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: IMG(fx, (await freshImage(fx)).id) }),
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/holes/:holeId/images/:imageId',
    need: 'logger',
    ok: 204,
    prepare: async (fx) => ({ path: IMG(fx, (await freshImage(fx)).id) }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/images/:imageId/file',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${IMG(fx, (await freshImage(fx)).id)}/file` }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/images/:imageId/tiles/:level/:tile',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${IMG(fx, (await freshImage(fx)).id)}/tiles/0/0` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/images/:imageId/fit',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => {
      const img = await freshImage(fx)
      return { path: `${IMG(fx, img.id)}/fit`, body: { points: pointsOn(img.topDepth) } }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/images/:imageId/picks',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${IMG(fx, (await freshImage(fx)).id)}/picks` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/images/:imageId/picks',
    need: 'logger',
    ok: 201,
    prepare: async (fx) => {
      const img = await freshImage(fx)
      return {
        path: `${IMG(fx, img.id)}/picks`,
        body: { points: pointsOn(img.topDepth), type: 'joint' },
      }
    },
  },
  {
    method: 'patch',
    route: '/api/projects/:projectId/holes/:holeId/images/:imageId/picks/:structureId',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => {
      const { img, s } = await freshImagePick(fx)
      return {
        path: `${IMG(fx, img.id)}/picks/${s.id}`,
        body: { type: 'vein', version: s.version },
      }
    },
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/holes/:holeId/images/:imageId/picks/:structureId',
    need: 'logger',
    ok: 204,
    prepare: async (fx) => {
      const { img, s } = await freshImagePick(fx)
      return { path: `${IMG(fx, img.id)}/picks/${s.id}?version=${s.version}` }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/images/:imageId/suggestions',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => {
      const img = await freshImage(fx)
      return {
        path: `${IMG(fx, img.id)}/suggestions?from=${img.topDepth}&to=${img.bottomDepth}`,
      }
    },
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/comments',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({
      path: `${P(fx)}/comments?entity=interval&entityId=${(await freshInterval(fx)).id}`,
    }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/comments',
    need: 'logger',
    ok: 201,
    prepare: async (fx) => ({
      path: `${P(fx)}/comments`,
      body: { entity: 'interval', entityId: (await freshInterval(fx)).id, body: 'looks fine' },
    }),
  },
  {
    method: 'get',
    route: '/api/projects/:projectId/audit',
    need: 'engineer',
    ok: 200,
    prepare: async (fx) => ({ path: `${P(fx)}/audit` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/submit',
    need: 'logger',
    ok: 200,
    prepare: async (fx) => ({ path: `${I(fx, (await freshInterval(fx)).id)}/submit` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/check',
    need: 'engineer',
    ok: 200,
    prepare: async (fx) => {
      const i = await freshInterval(fx)
      return { path: `${I(fx, i.id)}/check`, body: { version: i.version } }
    },
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/approve',
    need: 'lead',
    ok: 200,
    prepare: async (fx) => {
      const i = await freshInterval(fx)
      await fx.db.update(intervals).set({ status: 'checked' }).where(eq(intervals.id, i.id))
      return { path: `${I(fx, i.id)}/approve`, body: { version: i.version } }
    },
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/intervals/:intervalId/reopen',
    need: 'engineer',
    ok: 200,
    prepare: async (fx) => {
      const i = await freshInterval(fx)
      await fx.db.update(intervals).set({ status: 'checked' }).where(eq(intervals.id, i.id))
      return {
        path: `${I(fx, i.id)}/reopen`,
        body: { version: i.version, reason: 'recheck the set table' },
      }
    },
  },
  // core-to-image reconciliation: anyone reads it, engineers and leads accept or undo adjustments
  {
    method: 'get',
    route: '/api/projects/:projectId/holes/:holeId/reconciliation',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${H(fx)}/reconciliation?depthWindow=0.5&maxAngle=15` }),
  },
  {
    method: 'post',
    route: '/api/projects/:projectId/holes/:holeId/reconciliation/apply',
    need: 'engineer',
    ok: 201,
    prepare: async (fx) => ({
      path: `${H(fx)}/reconciliation/apply`,
      body: { runRotations: [{ runId: (await freshRun(fx)).id, rotation: 12.5 }] },
    }),
  },
  {
    method: 'delete',
    route: '/api/projects/:projectId/holes/:holeId/reconciliation/adjustments/:adjustmentId',
    need: 'engineer',
    ok: 200,
    prepare: async (fx) => {
      const run = await freshRun(fx)
      const [a] = await fx.db
        .insert(adjustments)
        .values({ holeId: fx.holeId, kind: 'run-rotation', runId: run.id, value: 7 })
        .returning()
      return { path: `${H(fx)}/reconciliation/adjustments/${a.id}` }
    },
  },
  // the project's error model: anyone reads it, the lead changes it
  {
    method: 'get',
    route: '/api/projects/:projectId/error-model',
    need: 'viewer',
    ok: 200,
    prepare: async (fx) => ({ path: `${P(fx)}/error-model` }),
  },
  {
    method: 'put',
    route: '/api/projects/:projectId/error-model',
    need: 'lead',
    ok: 200,
    prepare: async (fx) => {
      // The role is what is tested here: intervals approved by other cases would refuse the
      // recompute (freezing has its own tests in error-model.test.ts).
      await fx.db.update(intervals).set({ status: 'draft' }).where(eq(intervals.holeId, fx.holeId))
      const [p] = await fx.db.select().from(projects).where(eq(projects.id, fx.projectId))
      return {
        path: `${P(fx)}/error-model`,
        body: {
          model: { ...DEFAULT_ERROR_MODEL, alphaSd: 1 + unique() / 100 },
          version: p.version,
        },
      }
    },
  },
  // AGS4 checking (any signed-in user) and the standard dictionaries (administrators load them)
  {
    method: 'post',
    route: '/api/ags/validate',
    need: 'signed-in',
    ok: 400,
    prepare: async () => ({ path: '/api/ags/validate' }),
  },
  {
    method: 'get',
    route: '/api/ags/dictionaries',
    need: 'signed-in',
    ok: 200,
    prepare: async () => ({ path: '/api/ags/dictionaries' }),
  },
  {
    method: 'post',
    route: '/api/ags/dictionaries',
    need: 'admin',
    ok: 400,
    prepare: async () => ({ path: '/api/ags/dictionaries' }),
  },
  {
    method: 'delete',
    route: '/api/ags/dictionaries/:edition',
    need: 'admin',
    ok: 404,
    prepare: async () => ({ path: '/api/ags/dictionaries/4.0.3' }),
  },
  {
    method: 'get',
    route: '/api/users',
    need: 'admin',
    ok: 200,
    prepare: async () => ({ path: '/api/users' }),
  },
  {
    method: 'post',
    route: '/api/users',
    need: 'admin',
    ok: 201,
    prepare: async () => ({
      path: '/api/users',
      body: { email: `made${unique()}@test.example`, name: 'Made', password: 'long-enough-1' },
    }),
  },
  {
    method: 'patch',
    route: '/api/users/:userId',
    need: 'admin',
    ok: 200,
    prepare: async (fx) => {
      const u = await freshUser(fx)
      return { path: `/api/users/${u.id}`, body: { version: u.version, name: 'Renamed' } }
    },
  },
]

let fx: Fixture
const clients = {} as Record<Actor | 'anonymous', Client>
beforeAll(async () => {
  fx = await createFixture()
  // Fresh runs and stations sit thousands of metres down so they never overlap: a hole that deep.
  await fx.db.update(holes).set({ finalDepth: 100_000 }).where(eq(holes.id, fx.holeId))
  for (const who of [...actors, 'anonymous'] as const) clients[who] = await clientFor(fx.app, who)
})
afterAll(() => fx.close())

describe('role × route matrix', () => {
  for (const c of cases) {
    describe(`${c.method.toUpperCase()} ${c.route}`, () => {
      for (const who of ['anonymous', ...actors] as const) {
        const status = expected(c, who)
        it(`${c.method.toUpperCase()} ${c.route} → ${status} for ${who}`, async () => {
          const { path, body } = await c.prepare(fx)
          const client = clients[who]
          const res =
            c.method === 'get' || c.method === 'delete'
              ? await client[c.method](path)
              : await client[c.method](path, body)
          expect(res.status, JSON.stringify(res.body)).toBe(status)
          if (res.status >= 400) expect(res.body.error.code).toBeTypeOf('string')
        })
      }
    })
  }
})

// Cross-site request forgery: every write, by the most powerful caller, without the X-CSRF-Token
// header (or with another session's token) is refused with 403 before it does anything.
describe('CSRF × every write', () => {
  const writes = cases.filter((c) => c.method !== 'get')
  it(`covers every write route (${writes.length})`, () => {
    expect(writes.length).toBeGreaterThanOrEqual(45)
  })
  for (const c of writes) {
    it(`${c.method.toUpperCase()} ${c.route} → 403 csrf_token without the header and with a stranger's token`, async () => {
      const agent = request.agent(fx.app)
      const token = (await agent.get('/api/auth/csrf')).body.data.csrfToken as string
      await agent
        .post('/api/auth/login')
        .set('X-CSRF-Token', token)
        .send({ email: 'admin@test.example', password: PASSWORD })
      const stranger = clients.viewer.csrf
      const { path, body } = await c.prepare(fx)
      for (const header of [undefined, stranger]) {
        const req = agent[c.method](path)
        if (header) req.set('X-CSRF-Token', header)
        const res = c.method === 'delete' ? await req : await req.send(body ?? {})
        expect(res.status, JSON.stringify(res.body)).toBe(403)
        expect(res.body.error.code).toBe('csrf_token')
      }
    })
  }
})
