/**
 * The computational domain of a case: its dimensions, length, span, wetted area and volume, from
 * the optional domain description with defaults where it is silent (a 3-D domain; external: the
 * geometry's wetted-area factor times L x L; internal: a circular duct of 10 hydraulic diameters).
 */
import type { CaseInput } from './case-input'

export type Geometry = CaseInput['geometry']
export type Dimensions = '3d' | '2d' | 'axisymmetric' | 'span-periodic'
export type CrossSection = 'pipe' | 'channel' | 'duct'

/**
 * Wetted area relative to the reference wall: L x span for external flow (2 = both faces of a
 * surface), the duct's own walls for internal flow. Our assumptions (common practice, no source);
 * a real geometry can differ by several times, which the cost range carries.
 */
export const GEOMETRY_AREA_FACTOR: Readonly<Record<Geometry, number>> = {
  streamlined: 2,
  bluff: 3,
  duct: 1,
  rotating: 4,
  complex: 6,
}

/** Internal domain length in hydraulic diameters when none is given: a development length of that order (common practice, no source). */
export const DEFAULT_INTERNAL_LENGTH_RATIO = 10
/** Plane channel when no length or span is given: the periodic box of Kim, Moin & Moser 1987 (JFM 177, 133), 4 pi h long and 4/3 pi h wide. */
export const CHANNEL_LENGTH_IN_HALF_HEIGHTS = 4 * Math.PI
export const CHANNEL_SPAN_IN_HALF_HEIGHTS = (4 / 3) * Math.PI
/**
 * Span of a span-periodic scale-resolving run of a planar case, in reference lengths: pi for bluff
 * bodies (Kravchenko & Moin 2000, Phys. Fluids 12, 403, used pi D for the cylinder), 0.2 for aerofoils
 * and blades (common practice for aerofoil LES, from memory).
 */
export const PERIODIC_SPAN_BLUFF = Math.PI
export const PERIODIC_SPAN_STREAMLINED = 0.2

export interface Domain {
  dimensions: Dimensions
  /** RANS-type methods solve a 2-D (or axisymmetric) problem, one cell deep */
  planar: boolean
  /** internal flow only */
  crossSection: CrossSection | null
  /** streamwise length, m */
  length: number
  /** span of the 3-D or span-periodic domain that scale-resolving methods compute, m */
  span: number
  /** wetted area of that domain's walls, m2 */
  wettedArea: number
  /** wall-line length of a planar case's 2-D section (external: the wetted area per unit span), m */
  perimeter: number
  /** fluid volume of an internal domain, m3; external: the reference volume L x L x span */
  volume: number
  /** true when the wetted area came from the input */
  wettedAreaGiven: boolean
}

function periodicSpan(geometry: Geometry, length: number): number {
  return (geometry === 'bluff' || geometry === 'complex' ? PERIODIC_SPAN_BLUFF : PERIODIC_SPAN_STREAMLINED) * length
}

function externalDomain(input: CaseInput, dimensions: Dimensions): Domain {
  const planar = dimensions !== '3d'
  const span = input.domain?.span ?? (planar ? periodicSpan(input.geometry, input.length) : input.length)
  const perimeter = GEOMETRY_AREA_FACTOR[input.geometry] * input.length
  const given = input.domain?.wettedArea
  return {
    dimensions,
    planar,
    crossSection: null,
    length: (input.domain?.lengthRatio ?? 1) * input.length,
    span,
    wettedArea: given ?? perimeter * span,
    perimeter: given === undefined ? perimeter : given / span,
    volume: input.length * input.length * span,
    wettedAreaGiven: given !== undefined,
  }
}

function internalDomain(input: CaseInput, dimensions: Dimensions): Domain {
  const diameter = input.length
  const crossSection = input.domain?.crossSection ?? 'pipe'
  const channel = crossSection === 'channel'
  const halfHeight = diameter / 4
  const ratio = input.domain?.lengthRatio
  const length = ratio !== undefined ? ratio * diameter : channel ? CHANNEL_LENGTH_IN_HALF_HEIGHTS * halfHeight : DEFAULT_INTERNAL_LENGTH_RATIO * diameter
  const span = input.domain?.span ?? (channel ? CHANNEL_SPAN_IN_HALF_HEIGHTS * halfHeight : diameter)
  const area = GEOMETRY_AREA_FACTOR[input.geometry]
  const wallPerimeter = channel ? 2 * span : crossSection === 'duct' ? 4 * diameter : Math.PI * diameter
  const section = channel ? 2 * halfHeight * span : crossSection === 'duct' ? diameter * diameter : (Math.PI / 4) * diameter * diameter
  const given = input.domain?.wettedArea
  const wettedArea = given ?? area * wallPerimeter * length
  return {
    dimensions,
    planar: dimensions !== '3d',
    crossSection,
    length,
    span,
    wettedArea,
    // A planar duct has one wall line (axisymmetric pipe) or two (channel, duct) along its length.
    perimeter: given === undefined ? area * (crossSection === 'pipe' ? 1 : 2) * length : given / span,
    volume: section * length,
    wettedAreaGiven: given !== undefined,
  }
}

export function resolveDomain(input: CaseInput): Domain {
  const dimensions = input.domain?.dimensions ?? '3d'
  return input.regime === 'external' ? externalDomain(input, dimensions) : internalDomain(input, dimensions)
}
