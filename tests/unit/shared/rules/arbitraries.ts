/** fast-check generators of valid Eddyledger cases (test fixtures of ours). */
import fc from 'fast-check'
import type { CaseInputDraft } from '#shared/rules/case-input'
import { APPLICATIONS, QUANTITIES } from '#shared/rules/case-input'

const logUniform = (minExponent: number, maxExponent: number) =>
  fc.double({ min: minExponent, max: maxExponent, noNaN: true }).map((exponent) => 10 ** exponent)

const fluid = fc.oneof(
  fc.record({ medium: fc.constant('air' as const), temperatureK: fc.double({ min: 150, max: 1500, noNaN: true }), pressurePa: logUniform(3, 7) }),
  fc.record({ medium: fc.constant('water' as const), temperatureK: fc.double({ min: 274, max: 372, noNaN: true }) }),
  fc.record({ medium: fc.constant('custom' as const), density: logUniform(-2, 4), viscosity: logUniform(-6, 1) }),
)

/** The optional fields of engine 2.0, each present about half the time. */
const optionalFields = fc.record(
  {
    domain: fc.record(
      {
        dimensions: fc.constantFrom('3d' as const, '2d' as const, 'axisymmetric' as const, 'span-periodic' as const),
        lengthRatio: fc.double({ min: 0.5, max: 50, noNaN: true }),
        span: logUniform(-3, 2),
        crossSection: fc.constantFrom('pipe' as const, 'channel' as const, 'duct' as const),
      },
      { requiredKeys: [] },
    ),
    roughnessLengthFraction: fc.double({ min: 1e-6, max: 0.1, noNaN: true }),
    lowestFrequencyHz: logUniform(-2, 4),
    wallTemperatureK: fc.double({ min: 150, max: 1500, noNaN: true }),
    timeIntegration: fc.constantFrom('explicit' as const, 'implicit' as const),
    swirlNumber: fc.double({ min: 0, max: 2, noNaN: true }),
    application: fc.constantFrom(...APPLICATIONS),
  },
  { requiredKeys: [] },
)

export const validCase: fc.Arbitrary<CaseInputDraft> = fc
  .record({
    regime: fc.constantFrom('external' as const, 'internal' as const),
    fluid,
    velocity: logUniform(-3, 3),
    length: logUniform(-3, 3),
    // Up to the Colebrook-White range's end (k/D 0.05), with a margin: fraction x length / length can
    // round to just above it.
    roughnessFraction: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 0.0499, noNaN: true })),
    turbulenceIntensity: fc.double({ min: 0.001, max: 0.5, noNaN: true }),
    geometry: fc.constantFrom('streamlined' as const, 'bluff' as const, 'duct' as const, 'rotating' as const, 'complex' as const),
    separation: fc.constantFrom('none' as const, 'mild' as const, 'massive' as const),
    physics: fc.record({
      transition: fc.boolean(),
      heatTransfer: fc.boolean(),
      rotation: fc.boolean(),
      buoyancy: fc.boolean(),
      acoustics: fc.boolean(),
    }),
    quantities: fc.uniqueArray(fc.constantFrom(...QUANTITIES), { minLength: 1, maxLength: 4 }),
    budget: fc.record({
      coreHours: logUniform(1, 9),
      cores: fc.integer({ min: 1, max: 100000 }),
      wallClockHours: logUniform(0, 4),
    }),
    yPlusTarget: fc.option(fc.double({ min: 0.1, max: 1000, noNaN: true }), { nil: undefined }),
    growthRatio: fc.double({ min: 1.01, max: 2, noNaN: true }),
    optional: optionalFields,
  })
  .map(({ roughnessFraction, optional, ...rest }) => {
    const { domain, roughnessLengthFraction, ...others } = optional
    const useLength = rest.regime === 'external' && roughnessLengthFraction !== undefined && roughnessFraction === 0
    return {
      ...rest,
      ...others,
      ...(roughnessFraction > 0 ? { roughness: roughnessFraction * rest.length } : {}),
      ...(useLength ? { roughnessLength: Math.max(1e-7, Math.min(10, roughnessLengthFraction * rest.length)) } : {}),
      ...(domain ? { domain: rest.regime === 'internal' ? domain : { ...domain, crossSection: undefined } } : {}),
    }
  })

/** Walks a value and returns the paths of every number that is NaN or infinite. */
export function nonFiniteNumbers(value: unknown, path = '$'): string[] {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [path]
  if (Array.isArray(value)) return value.flatMap((item, index) => nonFiniteNumbers(item, `${path}[${index}]`))
  if (value && typeof value === 'object') {
    return Object.entries(value).flatMap(([key, item]) => nonFiniteNumbers(item, `${path}.${key}`))
  }
  return []
}
