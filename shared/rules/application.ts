/**
 * The kind of flow a case is, where that has its own published practice (atmospheric and indoor
 * air, ship hulls, turbomachinery, strongly swirling flow), and how strong any swirl is. Taken from
 * the input's `application` when given, otherwise inferred from the other fields with the
 * thresholds below; the advice says which it used.
 */
import type { Application, CaseInput } from './case-input'

/** An external bluff or complex body in air at least this long (m) is read as a building or structure in the atmospheric boundary layer (common practice, no source). */
export const ATMOSPHERIC_MIN_LENGTH = 10
/** An internal flow of air through a complex space at least this large (m), at most this fast (m/s), is read as room air (common practice, no source). */
export const INDOOR_MIN_LENGTH = 1
export const INDOOR_MAX_VELOCITY = 10
/** A streamlined body in water at least this long (m) is read as a ship hull (common practice, no source). */
export const MARINE_MIN_LENGTH = 10
/** Strong swirl, with a central recirculation (vortex breakdown), above a swirl number of about 0.6 (Gupta, Lilley & Syred 1984, Swirl Flows; from memory). */
export const STRONG_SWIRL_NUMBER = 0.6

export type SwirlStrength = 'none' | 'weak' | 'strong'

export interface ApplicationReading {
  application: Application
  /** true when taken from the input, false when inferred */
  given: boolean
  swirl: SwirlStrength
}

function inferred(input: CaseInput): Application {
  const { regime, geometry, fluid, length, velocity } = input
  if (geometry === 'rotating') return 'turbomachinery'
  if (regime === 'external') {
    if (input.roughnessLength !== undefined) return 'atmospheric'
    if (fluid.medium === 'air' && (geometry === 'bluff' || geometry === 'complex') && length >= ATMOSPHERIC_MIN_LENGTH) return 'atmospheric'
    if (fluid.medium === 'water' && geometry === 'streamlined' && length >= MARINE_MIN_LENGTH) return 'marine'
    return 'general'
  }
  if (input.physics.rotation || (input.swirlNumber ?? 0) >= STRONG_SWIRL_NUMBER) return 'swirl'
  const roomLike = geometry === 'complex' || geometry === 'bluff'
  if (fluid.medium === 'air' && roomLike && length >= INDOOR_MIN_LENGTH && velocity <= INDOOR_MAX_VELOCITY) return 'indoor'
  return 'general'
}

function swirlStrength(input: CaseInput, application: Application): SwirlStrength {
  if (input.swirlNumber !== undefined) {
    if (input.swirlNumber >= STRONG_SWIRL_NUMBER) return 'strong'
    return input.swirlNumber > 0 ? 'weak' : 'none'
  }
  if (application === 'swirl') return 'strong'
  return input.physics.rotation || input.geometry === 'rotating' ? 'weak' : 'none'
}

export function readApplication(input: CaseInput): ApplicationReading {
  const application = input.application ?? inferred(input)
  return { application, given: input.application !== undefined, swirl: swirlStrength(input, application) }
}
