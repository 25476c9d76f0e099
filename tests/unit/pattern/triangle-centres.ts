/** Triangle centres used as outside references by the Fermat–Torricelli tests. */

type P = [number, number]

/** X(13) from its trilinears csc(A + π/3) : csc(B + π/3) : csc(C + π/3) (C. Kimberling, Encyclopedia of Triangle Centers). */
export function isogonicCentre(A: P, B: P, C: P): P {
  const d = (p: P, q: P) => Math.hypot(p[0] - q[0], p[1] - q[1])
  const a = d(B, C), b = d(C, A), c = d(A, B)
  const angle = (opp: number, s1: number, s2: number) => Math.acos((s1 * s1 + s2 * s2 - opp * opp) / (2 * s1 * s2))
  const [tA, tB, tC] = [angle(a, b, c), angle(b, c, a), angle(c, a, b)].map(x => 1 / Math.sin(x + Math.PI / 3))
  // trilinears x : y : z → barycentrics a x : b y : c z
  const wa = a * tA!, wb = b * tB!, wc = c * tC!
  const s = wa + wb + wc
  return [(wa * A[0] + wb * B[0] + wc * C[0]) / s, (wa * A[1] + wb * B[1] + wc * C[1]) / s]
}
