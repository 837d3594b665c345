import type { ResolvedJoint, ResolvedLink } from '../resolve'
import type { CheckSpec, JointForces, LinkForces } from '../spec'

/** A design basis: turns resolved components and design forces into checks. */
export interface BasisImpl {
  /** Short label printed in every CheckItem's `basis`. */
  label: string
  pin(j: ResolvedJoint, f: JointForces): CheckSpec[]
  link(l: ResolvedLink, f: LinkForces): CheckSpec[]
  caution: string
}
