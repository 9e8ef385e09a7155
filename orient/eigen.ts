import type { Vec3 } from './types'

/** Eigen-decomposition of a symmetric 3×3 matrix, eigenvalues in descending order. */
export interface SymmetricEigen {
  readonly values: Vec3
  /** Unit eigenvectors, vectors[i] belonging to values[i]. */
  readonly vectors: readonly [Vec3, Vec3, Vec3]
}

/**
 * Cyclic Jacobi rotations (Jacobi 1846; Golub & Van Loan 2013, §8.5) on the symmetric matrix
 * [[xx, xy, xz], [xy, yy, yz], [xz, yz, zz]]. Accurate to rounding for every input, including
 * repeated eigenvalues, and converges in a handful of sweeps for 3×3.
 */
export function symmetricEigen3(
  xx: number,
  xy: number,
  xz: number,
  yy: number,
  yz: number,
  zz: number,
): SymmetricEigen {
  const a = [
    [xx, xy, xz],
    [xy, yy, yz],
    [xz, yz, zz],
  ]
  const v = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ]
  const pairs: [number, number, number][] = [
    [0, 1, 2],
    [0, 2, 1],
    [1, 2, 0],
  ]
  for (let sweep = 0; sweep < 32; sweep++) {
    const off = a[0][1] ** 2 + a[0][2] ** 2 + a[1][2] ** 2
    const diag = a[0][0] ** 2 + a[1][1] ** 2 + a[2][2] ** 2
    if (off <= 1e-36 * diag || off === 0) break
    for (const [p, q, r] of pairs) {
      const apq = a[p][q]
      if (apq === 0) continue
      const theta = (a[q][q] - a[p][p]) / (2 * apq)
      const t = (theta >= 0 ? 1 : -1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1))
      const c = 1 / Math.sqrt(t * t + 1)
      const s = t * c
      a[p][p] -= t * apq
      a[q][q] += t * apq
      a[p][q] = a[q][p] = 0
      const arp = a[r][p]
      const arq = a[r][q]
      a[r][p] = a[p][r] = c * arp - s * arq
      a[r][q] = a[q][r] = s * arp + c * arq
      for (let k = 0; k < 3; k++) {
        const vkp = v[k][p]
        const vkq = v[k][q]
        v[k][p] = c * vkp - s * vkq
        v[k][q] = s * vkp + c * vkq
      }
    }
  }
  const order = [0, 1, 2].sort((i, j) => a[j][j] - a[i][i])
  const column = (j: number): Vec3 => [v[0][j], v[1][j], v[2][j]]
  return {
    values: [a[order[0]][order[0]], a[order[1]][order[1]], a[order[2]][order[2]]],
    vectors: [column(order[0]), column(order[1]), column(order[2])],
  }
}
