/**
 * A mathjs instance with units only (keeps the browser bundle small), plus the few units a CFD
 * engineer types that mathjs does not define: the knot and the poise.
 */
import { create, createUnitDependencies, unitDependencies } from 'mathjs'

// The typings mark each dependency bundle as possibly undefined; both ship with mathjs 15.
export const math = create({ unitDependencies: unitDependencies!, createUnitDependencies: createUnitDependencies! })

// International nautical mile, 1852 m exactly (NIST SP 811, 2008, appendix B.8).
math.createUnit('nauticalMile', { definition: '1852 m' })
math.createUnit('knot', { definition: '1 nauticalMile/hour', aliases: ['knots'] })
// Poise: 1 P = 0.1 Pa s (NIST SP 811, 2008, appendix B.8); "cP" through the short prefixes.
math.createUnit('poise', { definition: '0.1 Pa s', prefixes: 'long' })
math.createUnit('P', { definition: '1 poise', prefixes: 'short' })
