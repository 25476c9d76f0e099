/**
 * Public entry of the pattern core: parse → compile → analyse / balance / solve phases.
 * Everything here is pure TypeScript (no Vue, Nitro or DOM) for workers, server and CLI.
 * The names are listed one by one so the surface can be read here; README.md says what each
 * file does. Helpers used only inside the core are imported from their files directly.
 */

// the compiled model and its combinatorics
export { compilePattern, degree, halfEdgeDirection, halfEdgeVector, type Lattice, type PatternModel } from './model'
export {
  badDegreeVertices, computeComponents, computeFaces, computeTopology, type Components, type Faces, type Topology,
} from './combinatorics'
export { checkOrientability, type Orientability } from './orientability'
export { cutSpaceBasis, cycleSpaceBasis, curlMatrix, divMatrix, gradientMatrix, spanningForest } from './operators'
export { cycleShifts, openFaces, sublatticeIndex } from './shifts'

// drawing, horizontal balance and rigidity
export { edgeLengths, edgeVectors, lengthFunctional, meanEdgeLength, minEdgeLength, orderMargins, totalLength } from './geometry'
export { balanceJacobian, balanceLatticeDerivative, balanceResidual } from './balance'
export {
  balancePattern, DEFAULT_BALANCE_OPTIONS, resolveBalanceOptions, solveBalance,
  type BalanceOptions, type BalancePatternResult, type BalanceSolveResult,
} from './balance-solve'
export { dampedNewton, type NewtonProblem, type NewtonResult, type NewtonSettings } from './newton'
export {
  analyzeRigidity, DEFAULT_RIGIDITY_OPTIONS, resolveRigidityOptions, trivialMotions,
  type RigidityOptions, type RigidityResult,
} from './rigidity'
export { sparseRigidity, type SparseRigidityRaw } from './rigidity-sparse'
export { inertiaOf, reducedSpectrum, type ReducedSpectrum } from './spectrum'
export { analyzePlaneRigidity, planeRigidityMatrix, type PlaneRigidityResult } from './plane-rigidity'

// phases and vertical balance on cuts
export { distanceToMirror, phaseDifferences, phaseJacobian, phaseResidual } from './phases'
export { levelStructure, NEAR_WALL_TOLERANCE, wallReport, type LevelStructure, type WallReport } from './vertical-levels'
export { levelAlphaDerivative, levelJacobian, levelResidual, modelLevels } from './vertical-balance'
export {
  analyzePhaseRigidity, DEFAULT_PHASE_SOLVE_OPTIONS, meanWeight, pinnedLevelJacobian, resolvePhaseSolveOptions, solvePhases,
  type PhaseRigidityResult, type PhaseSolveOptions, type PhaseSolveResult,
} from './phase-solve'

// the conditions of the published theorems
export { classifyVertices, type VertexKind, type VertexTowerVerdict } from './vertex-towers'
export { checkStraightDrawing, type StraightDrawingCheck } from './straight-drawing'
export { existenceChecklist, type ExistenceChecklist, type Hypothesis, type HypothesisStatus } from './existence'

// the report
export { analyzePattern, DEFAULT_ANALYZE_OPTIONS, resolveAnalyzeOptions, type AnalyzeOptions } from './analyze'
export { VERTICAL_BALANCE_DEFINITION, type PatternReport, type PatternVerdicts, type VerdictName } from './report'
export { supercell } from './supercell'
