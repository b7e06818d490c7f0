import { describe, expect, it } from 'vitest'
import { apparentOrder, gridConvergence, representativeSize } from '#shared/verification/grid-convergence'

// The worked example of Celik et al. 2008, ASME J. Fluids Eng. 130, 078001 (Table 1, first
// column): a 2-D study on N = 18000, 8000 and 4500 cells with phi = 6.063, 5.972, 5.863 gives
// r21 = 1.5, r32 = 1.333, p = 1.53, phi_ext = 6.1685, e_a = 1.5 %, e_ext = 1.7 %, GCI_fine = 2.2 %.
const CELIK = [
  { cells: 18000, value: 6.063 },
  { cells: 8000, value: 5.972 },
  { cells: 4500, value: 5.863 },
]

describe('grid convergence (Celik et al. 2008)', () => {
  it('reproduces the published worked example', () => {
    const r = gridConvergence(CELIK, 2)
    // Source: Celik et al. 2008, Table 1.
    expect(r.r21).toBeCloseTo(1.5, 10)
    expect(r.r32).toBeCloseTo(1.333, 3)
    expect(r.order).toBeCloseTo(1.53, 2)
    expect(r.extrapolated).toBeCloseTo(6.1685, 4)
    expect(r.approximateError).toBeCloseTo(0.015, 3)
    expect(r.extrapolatedError).toBeCloseTo(0.017, 3)
    expect(r.gciFine).toBeCloseTo(0.022, 3)
    expect(r.convergence).toBe('monotonic')
    expect(r.warnings).toEqual([])
  })

  it('gives the same result whatever order the grids are listed in, and uses the three finest of four', () => {
    const shuffled = gridConvergence([CELIK[2]!, CELIK[0]!, CELIK[1]!], 2)
    expect(shuffled.order).toBeCloseTo(1.534, 3)
    // A coarser fourth grid is shown, not used (Celik et al. 2008 work with three grids).
    const four = gridConvergence([...CELIK, { cells: 2000, value: 5.7 }], 2)
    expect(four.grids.map(g => g.used)).toEqual([true, true, true, false])
    expect(four.order).toBeCloseTo(shuffled.order!, 12)
    expect(four.warnings.join(' ')).toMatch(/three finest/)
  })

  it('recovers the order of an exactly second-order sequence with unequal ratios', () => {
    // phi(h) = 1 + h^2 on h = 1, 1.4, 2.1 (3-D): p = 2 and phi_ext = 1 exactly (Richardson
    // extrapolation, Roache 1994; the fixed point must find it when r21 != r32).
    const h = [0.01, 0.014, 0.021]
    const grids = h.map(x => ({ cells: Math.round(x ** -3), value: 1 + 1e3 * (representativeSize(Math.round(x ** -3), 3)) ** 2 }))
    const r = gridConvergence(grids, 3)
    expect(r.order).toBeCloseTo(2, 8)
    expect(r.extrapolated).toBeCloseTo(1, 8)
  })

  it('flags oscillatory and divergent sequences and small refinement ratios', () => {
    // Oscillation: the sign of the change alternates (Celik et al. 2008, s = sign(e32/e21)).
    const osc = gridConvergence([{ cells: 64000, value: 1.02 }, { cells: 8000, value: 0.97 }, { cells: 1000, value: 1.1 }], 3)
    expect(osc.convergence).toBe('oscillatory')
    expect(osc.warnings.join(' ')).toMatch(/Oscillatory/)
    // Divergence: the fine-grid change exceeds the coarse one (common practice, no source).
    const div = gridConvergence([{ cells: 64000, value: 1.3 }, { cells: 8000, value: 1.1 }, { cells: 1000, value: 1.0 }], 3)
    expect(div.convergence).toBe('divergent')
    // r = (1.2)^(1/3) per direction in 3-D is about 1.06, below 1.3 (Celik et al. 2008).
    const small = gridConvergence([{ cells: 1_200_000, value: 1.01 }, { cells: 1_000_000, value: 1.02 }, { cells: 800_000, value: 1.04 }], 3)
    expect(small.warnings.filter(w => /below 1.3/.test(w))).toHaveLength(2)
  })

  it('refuses fewer than three grids and repeated cell counts, and handles identical values', () => {
    expect(() => gridConvergence(CELIK.slice(0, 2), 2)).toThrow(/three grids/)
    expect(() => gridConvergence([CELIK[0]!, CELIK[0]!, CELIK[1]!], 2)).toThrow(/same number of cells/)
    const same = gridConvergence(CELIK.map(g => ({ ...g, value: 2 })), 2)
    expect(same.convergence).toBe('unchanged')
    expect(same.gciFine).toBeNull()
  })

  it('iterates to a fixed point of the order equation', () => {
    // With r21 = r32 the equation is explicit: p = ln(e32/e21) / ln r (Celik et al. 2008, eq. 5a with q = 0).
    const { order } = apparentOrder(2, 2, 0.01, 0.04)
    expect(order).toBeCloseTo(2, 12)
  })
})
