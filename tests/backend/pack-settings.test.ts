import { beforeAll, describe, expect, it } from 'vitest'
import { packSuite } from './pack-setup'
import { parseCsv } from './pack-text'

const { ctx, url, holeUrl, waitFor, fileText } = packSuite()
const as = ctx.as

interface RouteSet {
  name: string
  count: number
  mean: { dip: number; dipDirection: number } | null
  meanPole: { trend: number; plunge: number } | null
  kappa: number | null
  alpha95: number | null
}
interface RouteIntersection {
  nameA: string
  nameB: string
  trend: number | null
  plunge: number | null
  angle: number | null
}

/** The analysis route as the screen calls it: no query, so the interval's saved settings. */
async function analysisOf(intervalId: number, query = '') {
  const res = await as.viewer!.get(`${holeUrl()}/intervals/${intervalId}/analysis${query}`)
  expect(res.status).toBe(200)
  return res.body.data as {
    settings: { used: { weighting: string }; overridden: string[] }
    sets: RouteSet[]
    intersections: RouteIntersection[]
  }
}

// Common practice: a file's number equals the route's when both print it to the file's decimals.
const printed = (x: number | null | undefined, d: number) =>
  x === null || x === undefined ? '' : x.toFixed(d)

describe('an issued pack of two intervals with different saved settings', () => {
  let id = ''
  let sets: Record<string, string>[] = []
  let crossings: Record<string, string>[] = []
  beforeAll(async () => {
    id = (await as.lead!.post(url(), {})).body.data.id
    expect((await waitFor(as.lead!, id)).status).toBe('ready')
    const issued = await as.lead!.post(`${url()}/${id}/issue`)
    expect(issued.status).toBe(200)
    expect(issued.body.data.status).toBe('issued')
    sets = parseCsv((await fileText(as.viewer!, id, 'sets.csv')).toString()).data
    crossings = parseCsv((await fileText(as.viewer!, id, 'intersections.csv')).toString()).data
  })

  it('GET …/analysis (no query) → every set mean, pole, K and alpha95 in sets.csv, per interval', async () => {
    for (const [intervalId, name, weighting] of [
      [ctx.intervalId, 'upper', 'terzaghi'],
      [ctx.lowerId, 'lower', 'none'],
    ] as const) {
      const route = await analysisOf(intervalId)
      expect(route.settings.used.weighting).toBe(weighting)
      expect(route.settings.overridden).toEqual([])
      const rows = sets.filter((r) => r.interval === name)
      expect(rows.map((r) => r.set)).toEqual(route.sets.map((s) => s.name))
      route.sets.forEach((s, i) => {
        const row = rows[i]
        expect(row.weighting).toBe(weighting)
        expect(row.count).toBe(String(s.count))
        expect(row.mean_dip_deg).toBe(printed(s.mean?.dip, 2))
        expect(row.mean_dip_direction_deg).toBe(printed(s.mean?.dipDirection, 2))
        expect(row.mean_pole_trend_deg).toBe(printed(s.meanPole?.trend, 2))
        expect(row.mean_pole_plunge_deg).toBe(printed(s.meanPole?.plunge, 2))
        expect(row.fisher_k).toBe(printed(s.kappa, 1))
        expect(row.alpha95_deg).toBe(printed(s.alpha95, 2))
        expect(row.mean_pole_trend_deg).not.toBe('')
      })
    }
  })

  it('GET …/analysis (no query) → every intersection in intersections.csv, per interval', async () => {
    for (const [intervalId, name, pairs] of [
      [ctx.intervalId, 'upper', 1],
      [ctx.lowerId, 'lower', 3],
    ] as const) {
      const route = await analysisOf(intervalId)
      const rows = crossings.filter((r) => r.interval === name)
      expect(rows).toHaveLength(pairs)
      expect(
        rows.map((r) => [r.set_a, r.set_b, r.trend_deg, r.plunge_deg, r.angle_between_planes_deg]),
      ).toEqual(
        route.intersections.map((x) => [
          x.nameA,
          x.nameB,
          printed(x.trend, 2),
          printed(x.plunge, 2),
          printed(x.angle, 2),
        ]),
      )
    }
  })

  it('GET …/analysis?weighting=terzaghi on the unweighted interval → other numbers than its pack rows', async () => {
    // The check above can tell the settings apart: Terzaghi weights (Terzaghi 1965) move the means.
    const explored = await analysisOf(ctx.lowerId, '?weighting=terzaghi')
    expect(explored.settings.overridden).toEqual(['weighting'])
    const rows = sets.filter((r) => r.interval === 'lower')
    const differs = explored.sets.some(
      (s, i) =>
        printed(s.mean?.dip, 2) !== rows[i].mean_dip_deg ||
        printed(s.mean?.dipDirection, 2) !== rows[i].mean_dip_direction_deg ||
        printed(s.kappa, 1) !== rows[i].fisher_k,
    )
    expect(differs).toBe(true)
  })
})
