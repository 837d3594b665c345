/**
 * The engine of the approximate straight-line four-bars (Watt's, Chebyshev's, Roberts', Hoeken's,
 * declared with their sizing rules in lib/mechanisms): tracer path and straightness, footprint,
 * statics with a virtual-work check, and the "Choice of mechanism" comparison with the exact cells.
 * Pure; imports only lib/contract types.
 */
export { analyseFourBar, STRAIGHTNESS_SAMPLES } from './analyse'
export type { FourBarOptions, FourBarPosition, FourBarResult, Peak } from './analyse'
export { compareStraightLineMechanisms, exactRow, straightnessStep, tableRow } from './compare'
export type { Comparison, ComparisonInput, ComparisonRow, ExactCellRow } from './compare'
export { fromAssembly, ruleNumber, strokeEnds } from './linkages'
export type { SizedFourBar } from './linkages'
export { branchOf, poseAt, staticsAt } from './model'
export type { FourBar, FourBarPose, FourBarStatics } from './model'
export { circleCircle, fitLine, offsetFrom } from './geometry'
export type { LineFit } from './geometry'
