/** Panel operations: style lines, separate, join, carry, true seams, notches, grain, fold, allowance. */
export * from './panel-types';
export * from './panel-tolerances';
export { styleLine, styleLineOnOutline, type StyleLineParams } from './style-line';
export { separate, type SeparateParams } from './separate';
export { join, type JoinParams } from './join';
export { carry, type CarryParams, type CarryResult, type CarryResidual, type CarrySeam } from './carry';
export { trueSeam, type TrueSeamParams, type TrueSeamResult, type SeamLengths } from './true-seam';
export { sewnLength } from './seam-measure';
export { notch, outlineCorners, type NotchParams } from './notch';
export { divergencePoint, type DivergencePointParams } from './divergence-point';
export { grain, type GrainParams, type GrainDirection } from './grain';
export { fold, unfold, FOLD_STRAIGHTNESS_MM } from './fold';
export { allowance, ALLOWANCE_FLATTEN_MM, ALLOWANCE_SIMPLIFY_MM, type AllowanceParams, type AllowanceResult, type AllowanceCorner } from './allowance';
export { allowanceEdges, bridgedOutline, type AllowanceEdge } from './allowance-edges';
export { CLIPPER_SCALE } from './clipper-tools';
