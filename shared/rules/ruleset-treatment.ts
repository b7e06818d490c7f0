/**
 * Treatment-stage rules: the wall treatment of the modelled approaches (steady and unsteady RANS,
 * hybrid RANS-LES), chosen from the physics alone. They run in this order and a later rule's
 * choice replaces an earlier one's; the budget plays no part here, it only ranks.
 */
import type { RulesetSource } from './ruleset-schema'

type RuleSource = RulesetSource['rules'][number]

const MODELLED = ['rans', 'urans', 'hybrid'] as const
const all = (treatment: 'resolved' | 'blended' | 'wall-function' | 'rough-wall-function') =>
  Object.fromEntries(MODELLED.map((id) => [id, treatment]))

export const heatTransferWanted = {
  or: [{ var: 'physics.heatTransfer' }, { in: ['heat-transfer', { var: 'quantities' }] }],
}

export const TREATMENT_RULES: RuleSource[] = [
  {
    id: 'blended-wall-where-y-plus-varies',
    title: 'A blended wall treatment where the first-cell y+ cannot be held',
    stage: 'treatment',
    when: {
      and: [{ in: [{ var: 'geometry' }, ['bluff', 'complex', 'duct']] }, { '>=': [{ var: 'deltaPlus' }, 300] }],
    },
    effects: { wallTreatment: all('blended') },
    why:
      'Over bluff and complex bodies and through ducts with fittings, the friction velocity varies so much that one mesh puts the first cell anywhere from the sublayer to the log layer. ' +
      "A blended law of the wall, Spalding's single formula or the compound treatment of Popovac & Hanjalić, is valid at any first-cell y+, so the answer does not hinge on where the cell falls. " +
      'The mesh is planned at **y+ ≈ 5**; keep it below 1 where friction or heat flux on a surface is itself the result.',
    source: 'Spalding 1961, J. Appl. Mech. 28, 455; Popovac & Hanjalić 2007, Flow Turbul. Combust. 78, 177 (from memory)',
  },
  {
    id: 'high-reynolds-wall-functions',
    title: 'Log-law wall functions at very high Reynolds numbers',
    stage: 'treatment',
    when: {
      and: [
        { '>=': [{ var: 'deltaPlus' }, 30000] },
        { in: [{ var: 'machRegime' }, ['incompressible', 'subsonic-compressible']] },
      ],
    },
    effects: { wallTreatment: all('wall-function') },
    why:
      'When the boundary layer is tens of thousands of wall units thick (full-scale ships, buildings, Reynolds numbers near 1e8 and above), the log layer spans most of it. ' +
      'Log-law wall functions then hold over the attached walls, and resolving the sublayer would add dozens of layers of cells with aspect ratios beyond what solvers tolerate. ' +
      'Shock-bearing flows are left resolved by a later rule.',
    source: 'Launder & Spalding 1974, Comput. Methods Appl. Mech. Eng. 3, 269; ITTC 2011 Recommended Procedure 7.5-03-03-01 (practical guidelines for ship CFD; from memory)',
  },
  {
    id: 'rough-walls-need-rough-wall-functions',
    title: 'Rough walls: log-law functions shifted for roughness',
    stage: 'treatment',
    when: {
      or: [
        { '>=': [{ var: 'roughnessPlus' }, 70] },
        { and: [{ '>=': [{ var: 'roughnessPlus' }, 5] }, { '>=': [{ var: 'deltaPlus' }, 30000] }] },
      ],
    },
    effects: { wallTreatment: all('rough-wall-function') },
    why:
      'Once the roughness Reynolds number k_s+ passes about 70 the wall is fully rough: the viscous sublayer is destroyed and friction no longer depends on viscosity, so resolving it is meaningless. ' +
      "A rough-wall function shifts the log law by the roughness function of the sand-grain height (Nikuradse's measurements) and keeps the first cell centre above the roughness elements. " +
      'At very high Reynolds numbers transitionally rough walls (k_s+ from 5) are treated the same way.',
    source: 'Nikuradse 1933 (via Schlichting, Boundary-Layer Theory); Cebeci & Bradshaw 1977, Momentum Transfer in Boundary Layers; Blocken, Stathopoulos & Carmeliet 2007, Atmos. Environ. 41, 238 (from memory)',
  },
  {
    id: 'smooth-surface-separation-needs-resolved-wall',
    title: 'Separation from a smooth surface needs a resolved wall',
    stage: 'treatment',
    when: {
      and: [
        { '!=': [{ var: 'separation' }, 'none'] },
        { in: [{ var: 'geometry' }, ['streamlined', 'rotating']] },
        { '<': [{ var: 'deltaPlus' }, 30000] },
        { '<': [{ var: 'roughnessPlus' }, 70] },
      ],
    },
    effects: { wallTreatment: all('resolved') },
    why:
      'Where a boundary layer separates from a smooth surface under an adverse pressure gradient, the separation point is the result, and the wall shear stress passes through zero there. ' +
      'The equilibrium assumption behind wall functions fails exactly there, so the wall is resolved (**y+ ≤ 1**) and the model integrates to it.',
    source: 'Launder & Spalding 1974 (equilibrium assumption); ERCOFTAC Best Practice Guidelines, Casey & Wintergerste 2000 (from memory)',
  },
  {
    id: 'shocks-need-resolved-wall',
    title: 'Shocks on boundary layers need a resolved wall',
    stage: 'treatment',
    when: { in: [{ var: 'machRegime' }, ['transonic', 'supersonic', 'hypersonic']] },
    effects: { wallTreatment: all('resolved') },
    why:
      'Where a shock meets a boundary layer, the pressure jump thickens or separates the layer, and the shock position follows. ' +
      'Wall functions assume an equilibrium log layer and misplace both, so transonic and supersonic cases are meshed to **y+ ≤ 1**, as in the published verification cases.',
    source: 'Knight & Degrez 1998, AGARD AR-319 (shock/boundary-layer interaction); NASA Turbulence Modeling Resource practice (from memory)',
  },
  {
    id: 'heat-transfer-needs-resolved-wall',
    title: 'Heat transfer needs a resolved wall',
    stage: 'treatment',
    when: { and: [heatTransferWanted, { '<': [{ var: 'roughnessPlus' }, 70] }] },
    effects: {
      wallTreatment: all('resolved'),
      cautions: [
        'Heat transfer: keep the first cell centre at y+ ≤ 1 over every heated or cooled wall and check it on the solution; wall functions give unreliable heat flux wherever the boundary layer is not in equilibrium.',
      ],
    },
    why:
      'The thermal sublayer sets the wall heat flux, and wall-function estimates of it are unreliable in impinging, separating or accelerating flow. ' +
      'Where heat transfer matters, resolve the wall (**y+ ≤ 1**) and let the model integrate to it.',
    source: 'ERCOFTAC Best Practice Guidelines, Casey & Wintergerste 2000 (from memory)',
  },
  {
    id: 'transition-needs-resolved-wall',
    title: 'Laminar or transitional boundary layers need a resolved wall',
    stage: 'treatment',
    when: {
      or: [
        { var: 'physics.transition' },
        { '!=': [{ var: 'flowState' }, 'turbulent'] },
        { '!=': [{ var: 'boundaryLayerState' }, 'turbulent'] },
      ],
    },
    effects: { wallTreatment: all('resolved') },
    why:
      'A laminar or transitional boundary layer has no log layer, and transition models follow the growth of disturbances inside it on meshes with the first cell at **y+ ≈ 1**. ' +
      'A wall function assumes a turbulent layer and removes what they need.',
    source: 'Langtry & Menter 2009, AIAA J. 47, 2894',
  },
  {
    id: 'no-log-layer-for-wall-functions',
    title: 'Boundary layer too thin for a log layer',
    stage: 'treatment',
    when: { '<': [{ var: 'deltaPlus' }, 300] },
    effects: { wallTreatment: all('resolved') },
    why:
      'The log layer runs from about y+ = 30 to about a tenth of the boundary-layer thickness. ' +
      'With the thickness below about 300 wall units there is no log layer for a wall-function cell to sit in, so the wall is resolved.',
    source: 'Law of the wall, e.g. Pope, Turbulent Flows 2000, ch. 7 (from memory)',
  },
]
