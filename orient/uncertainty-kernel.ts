import { EPSILON } from './math'

// The conversions of core.ts, image-pick.ts and vector.ts written on sines and cosines, so the
// Monte Carlo can feed them perturbed sines and cosines without a trigonometric call. Each writes
// the unit pole (east, north, up) into out[0..2]; tests hold them equal to coreToPlane and
// imagePickToPlane to 1e-10.

/**
 * Core pole n = sin α z′ − cos α (cos β x′ + sin β y′) with the hole frame of holeFrame
 * (z′ = (sT cP, cT cP, −sP), x′ = (−sT sP, −cT sP, −cP), y′ = (−cT, sT, 0)), expanded; beta from
 * the bottom of hole. A high-side image pick is the same with β = trough + 180°, i.e. (−sθ, −cθ).
 */
export function corePoleTrig(
  out: Float64Array,
  sa: number,
  ca: number,
  sb: number,
  cb: number,
  sT: number,
  cT: number,
  sP: number,
  cP: number,
): void {
  out[0] = sa * sT * cP + ca * (cb * sT * sP + sb * cT)
  out[1] = sa * cT * cP + ca * (cb * cT * sP - sb * sT)
  out[2] = ca * cb * cP - sa * sP
}

/**
 * Pole of a north-referenced image pick: image azimuth 0 is north projected onto the plane normal
 * to the hole, r = normalise(N − (N·z′)z′), and azimuth turns toward z′ × r (as imagePickToPlane).
 * False, out untouched, where projected north vanishes (a horizontal north–south hole).
 */
export function northPickPoleTrig(
  out: Float64Array,
  sa: number,
  ca: number,
  sTh: number,
  cTh: number,
  sT: number,
  cT: number,
  sP: number,
  cP: number,
): boolean {
  const zx = sT * cP
  const zy = cT * cP
  const zz = -sP
  const h = Math.sqrt(Math.max(0, 1 - zy * zy))
  if (h < EPSILON) return false
  const k = 1 / h
  const rx = -zy * zx * k
  const ry = h
  const rz = -zy * zz * k
  // y = z′ × r
  const yx = zy * rz - zz * ry
  const yy = zz * rx - zx * rz
  const yz = zx * ry - zy * rx
  out[0] = sa * zx - ca * (cTh * rx + sTh * yx)
  out[1] = sa * zy - ca * (cTh * ry + sTh * yy)
  out[2] = sa * zz - ca * (cTh * rz + sTh * yz)
  return true
}

/** Pole of a plane from the sines and cosines of its dip direction and dip (planeToPoleVec). */
export function truePoleTrig(
  out: Float64Array,
  sdd: number,
  cdd: number,
  sd: number,
  cd: number,
): void {
  out[0] = -sdd * sd
  out[1] = -cdd * sd
  out[2] = -cd
}

/**
 * Two unit vectors spanning the plane normal to the unit vector n (e1 horizontal unless n is
 * vertical), written to out[0..5]: the tangent-plane coordinates of the ellipse.
 */
export function tangentBasis(out: Float64Array, nx: number, ny: number, nz: number): void {
  const h = Math.hypot(nx, ny)
  if (h < 1e-9) {
    out.set([1, 0, 0, 0, 1, 0])
    return
  }
  const e1x = ny / h
  const e1y = -nx / h
  out[0] = e1x
  out[1] = e1y
  out[2] = 0
  // e2 = n × e1
  out[3] = -nz * e1y
  out[4] = nz * e1x
  out[5] = nx * e1y - ny * e1x
}
