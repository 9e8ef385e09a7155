import { describe, expect, it } from 'vitest'
import { polygonContains } from 'd3'
import {
  apparentDip,
  azimuthDifference,
  kinematicChecks,
  poleOf,
  type Plane,
} from '../../orient/index'
import {
  planarZone,
  topplingZone,
  wedgeZone,
  type ZoneSettings,
} from '../../frontend/src/logic/net/net-kinematic-zones'
import { toScreen } from '../../frontend/src/logic/net/net-geometry'

// The zones drawn on the net hold exactly what orient's kinematic rules accept: planes on a lattice
// are checked by kinematicChecks and by the drawn polygon; those within 1.5° of a limit are left
// out (the polygon's arcs are chords there).
const settings: ZoneSettings = {
  face: { dip: 70, dipDirection: 190 },
  friction: 30,
  lateralLimit: 20,
  topplingLimit: 30,
}
const R = 100

function polygon(d: string): [number, number][] {
  return [...d.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])])
}

const lattice: Plane[] = []
for (let dip = 1; dip < 90; dip += 3.7)
  for (let dd = 0; dd < 360; dd += 4.3) lattice.push({ dip, dipDirection: dd })

for (const projection of ['equal-area', 'equal-angle'] as const) {
  describe(`kinematic zones on the ${projection} net`, () => {
    it('planar sliding: the shaded sector holds the poles orient finds possible', () => {
      const zone = polygon(planarZone(settings, projection, R))
      const verdicts = kinematicChecks(settings, lattice, [])!.planar
      let checked = 0
      lattice.forEach((p, i) => {
        const near =
          Math.abs(azimuthDifference(p.dipDirection, 190) - 20) < 1.5 ||
          Math.abs(p.dip - 70) < 1.5 ||
          Math.abs(p.dip - 30) < 1.5
        if (near) return
        const s = toScreen(poleOf(p)!, projection, R)!
        expect(polygonContains(zone, [s.x, s.y]), `${p.dip}/${p.dipDirection}`).toBe(
          verdicts[i].possible,
        )
        checked++
      })
      expect(checked).toBeGreaterThan(1500)
      expect(verdicts.some((v) => v.possible)).toBe(true)
    })

    it('flexural toppling: the shaded sector holds the poles orient finds possible', () => {
      const zone = polygon(topplingZone(settings, projection, R))
      const verdicts = kinematicChecks(settings, lattice, [])!.toppling
      lattice.forEach((p, i) => {
        const near =
          Math.abs(azimuthDifference(p.dipDirection, 10) - 30) < 1.5 ||
          Math.abs(90 - p.dip + 30 - 70) < 1.5
        if (near) return
        const s = toScreen(poleOf(p)!, projection, R)!
        expect(polygonContains(zone, [s.x, s.y]), `${p.dip}/${p.dipDirection}`).toBe(
          verdicts[i].possible,
        )
      })
      expect(verdicts.some((v) => v.possible)).toBe(true)
    })

    it('wedge sliding: the crescent holds the lines that daylight and plunge above friction', () => {
      const zone = polygon(wedgeZone(settings, projection, R))
      let inside = 0
      for (let plunge = 1; plunge < 90; plunge += 3.1)
        for (let trend = 0; trend < 360; trend += 3.7) {
          const apparent = apparentDip(settings.face, trend)!
          const off = azimuthDifference(trend, 190)
          if (
            Math.abs(off - 90) < 1.5 ||
            Math.abs(plunge - apparent) < 1.5 ||
            Math.abs(plunge - 30) < 1.5
          )
            continue
          const expected = off < 90 && plunge < apparent && plunge > 30
          const s = toScreen({ trend, plunge }, projection, R)!
          expect(polygonContains(zone, [s.x, s.y]), `${trend}/${plunge}`).toBe(expected)
          if (expected) inside++
        }
      expect(inside).toBeGreaterThan(20)
    })
  })
}
