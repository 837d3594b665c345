import { linkLength, type LinkageModel } from './model'
import type { EnvelopeOut, ExtremeOut } from './results'
import type { CaseSample } from './sweep'

/** Keeps the sample where key() is largest, with its crank angle. */
function track(samples: CaseSample[], key: (s: CaseSample) => number | undefined): ExtremeOut & { found: boolean } {
  let best = { value: 0, crankDeg: samples[0]?.position.crankDeg ?? 0, found: false }
  for (const s of samples) {
    const v = key(s)
    if (v !== undefined && (!best.found || v > best.value)) best = { value: v, crankDeg: s.position.crankDeg, found: true }
  }
  return best
}

const strip = (e: ExtremeOut & { found: boolean }): ExtremeOut => ({ value: e.value, crankDeg: e.crankDeg })

/**
 * Largest demands over the sweep. Tension positive throughout: maxTension is
 * ≥ 0 and maxCompression ≤ 0 (0 when the link never sees that sign).
 */
export function envelopeOf(model: LinkageModel, loadCase: string, samples: CaseSample[]): EnvelopeOut {
  const links: EnvelopeOut['links'] = {}
  for (const l of model.links) {
    const t = track(samples, (s) => s.members[l.name].axialMax)
    const c = track(samples, (s) => -s.members[l.name].axialMin)
    const m = track(samples, (s) => s.position.linkMoments?.[l.name])
    links[l.name] = {
      length: linkLength(l),
      maxTension: { value: Math.max(t.value, 0), crankDeg: t.crankDeg },
      maxCompression: { value: Math.min(-c.value, 0), crankDeg: c.crankDeg },
      ...(m.found ? { maxMoment: strip(m) } : {}),
    }
  }
  const pins: EnvelopeOut['pins'] = {}
  for (const j of Object.keys(model.attached)) pins[j] = strip(track(samples, (s) => s.position.pinForces[j]?.magnitude))
  const torque = track(samples, (s) => Math.abs(s.position.driveTorque))
  const at = samples.find((s) => s.position.crankDeg === torque.crankDeg)
  return {
    loadCase,
    links,
    pins,
    driveTorque: { value: at ? at.position.driveTorque : 0, crankDeg: torque.crankDeg },
  }
}
