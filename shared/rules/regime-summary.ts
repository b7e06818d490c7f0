/**
 * The regime of a case in one sentence, with the threshold it was judged against, and as the
 * advice's regime block.
 */
import type { RegimeAdvice, RoughnessAdvice } from './advice-types'
import type { FlowPhysics } from './flow-physics'
import { formatNumber } from './format'
import type { MachRegime, RegimeBasis } from './regime'

const BASIS: Readonly<Record<RegimeBasis, string>> = {
  pipe: 'duct flow on its hydraulic diameter',
  plate: 'boundary layer on the reference length',
  'bluff-wake': 'bluff-body wake',
}

const MACH: Readonly<Record<MachRegime, string>> = {
  incompressible: 'incompressible',
  'subsonic-compressible': 'compressible subsonic',
  transonic: 'transonic',
  supersonic: 'supersonic',
  hypersonic: 'hypersonic',
}

function summary(physics: FlowPhysics): string {
  const { regime, reynolds, mach } = physics
  const { laminarBelow, turbulentAbove } = regime.thresholds
  const parts = [
    `${regime.state[0]!.toUpperCase()}${regime.state.slice(1)} at Re = ${formatNumber(reynolds)} (${BASIS[regime.basis]}: laminar below ${formatNumber(laminarBelow)}, turbulent above ${formatNumber(turbulentAbove)})`,
  ]
  if (regime.boundaryLayer !== regime.state) parts.push(`${regime.boundaryLayer} boundary layer`)
  if (regime.wake !== 'none') parts.push(`wake ${regime.wake.replace('-', ' ')}`)
  if (regime.strouhal !== null) parts.push(`shedding at a Strouhal number of about ${formatNumber(regime.strouhal)}`)
  const machText = mach === null ? 'incompressible liquid or custom fluid' : `${MACH[regime.mach]}, Mach ${formatNumber(mach)}`
  parts.push(machText)
  if (physics.reference && mach !== null && mach >= 0.3) parts.push(`wall figures at a reference temperature of ${formatNumber(physics.reference.temperatureK)} K`)
  return `${parts.join('; ')}.`
}

export function regimeAdvice(physics: FlowPhysics): RegimeAdvice {
  const { regime, application } = physics
  return {
    state: regime.state,
    boundaryLayer: regime.boundaryLayer,
    wake: regime.wake,
    basis: regime.basis,
    mach: regime.mach,
    strouhal: regime.strouhal,
    thresholds: { laminarBelow: regime.thresholds.laminarBelow, turbulentAbove: regime.thresholds.turbulentAbove },
    application: application.application,
    applicationGiven: application.given,
    swirl: application.swirl,
    summary: summary(physics),
  }
}

export function roughnessAdvice(physics: FlowPhysics): RoughnessAdvice | null {
  const roughness = physics.roughness
  if (!roughness) return null
  return {
    sandGrainHeight: roughness.sandGrainHeight,
    roughnessLength: roughness.roughnessLength,
    roughnessPlus: roughness.roughnessPlus,
    regime: roughness.regime,
    logLawShift: roughness.logLawShift,
  }
}
