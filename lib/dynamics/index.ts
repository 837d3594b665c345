/**
 * Forces at operating speed (issue 12, item 2): link masses from their sections, kinematics at
 * speed from the loop-closure equations, d'Alembert kinetostatics as an extra load case, and the
 * virtual-power check. Pure: no framework, no storage.
 */
export { runDynamics, mechanismDynamics, dynamicEnvelope, type DynamicsInput, type MechanismDynamicsInput, type DynamicsResult, type DynamicCase, type DynamicSample, type PositionKinematics } from './run'
export { linkMasses, slenderBar, bodyFromSection, type LinkBody, type LinkMass, type AddedMass } from './mass'
export { crankRate, describeMotion, RPM, type MotionLaw, type CrankRate } from './motion'
export { unitRates, kinematicsWorkspace, linkMotions, jointMotions, type UnitRates, type LinkMotion, type PointMotion } from './kinematics'
export { solveLoadSets, memberForcesAlong, equilibriumResidual, KG_MM_S2_TO_N, type PositionLoads, type LinkLoad } from './kinetostatics'
export { virtualPower, closedFormRates, VP_STEP, type VirtualPower } from './virtual-power'
export { dynamicsSteps, dynamicsTables, VP_TOLERANCE, EQ_TOLERANCE } from './steps'
