/**
 * One-line explanations of the workbench's controls and numbers, shown on hover (title) and in
 * the legends of the phase and verdict panels. One wording in every place.
 */
export const CONTROL_HELP = {
  alpha: 'α₁, α₂ [rad]: the phase shifts the two lattice periods w₁, w₂ add to an edge\'s phase difference (torus only; the plane has none)',
  weight: 'K (default 1) [dimensionless]: the strength of the vertical interaction along an edge, set by the two towers\' wings; only its ratios among edges of equal length change a verdict',
  phi: 'φ [rad]: the phase difference along an edge, far-end tower minus near-end tower plus k·α (mod 2π)',
  phiPlane: 'φ [rad]: the phase difference along an edge, far-end tower minus near-end tower (mod 2π)',
  sigmaMin: 'rigidity margin σ_min [dimensionless]: the smallest singular value of the balance Jacobian with the trivial motions removed, × the mean edge length (phases: ÷ the mean K); near 0 the pattern is close to losing rigidity',
  inertia: 'inertia n₋/n₀/n₊: how many eigenvalues of the rigidity matrix F_u are negative, zero and positive; a change along a family marks a branch point or a loss of rigidity',
} as const
