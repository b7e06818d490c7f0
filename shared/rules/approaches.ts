/**
 * The approaches the engine weighs, the wall treatments, and the published models a case may use
 * under each approach.
 */

/**
 * The six turbulence approaches, from the most resolved to the most modelled. Every advice lists
 * these six.
 */
export const TURBULENCE_APPROACH_IDS = ['dns', 'wrles', 'wmles', 'hybrid', 'urans', 'rans'] as const

/**
 * Every approach a decision may name: the six turbulence approaches and a laminar solution, which
 * an advice lists only when the flow is laminar or transitional.
 */
export const APPROACH_IDS = [...TURBULENCE_APPROACH_IDS, 'laminar'] as const
export type ApproachId = (typeof APPROACH_IDS)[number]

export const APPROACH_LABELS: Readonly<Record<ApproachId, string>> = {
  dns: 'Direct numerical simulation (DNS)',
  wrles: 'Wall-resolved LES',
  wmles: 'Wall-modelled LES',
  hybrid: 'Hybrid RANS-LES (DES family)',
  urans: 'Unsteady RANS',
  rans: 'Steady RANS',
  laminar: 'Laminar solution (no turbulence model)',
}

/** Approaches that resolve the turbulent eddies down to the grid scale. */
export const RESOLVING_APPROACHES: ReadonlySet<ApproachId> = new Set(['dns', 'wrles', 'wmles'])

export const WALL_TREATMENTS = ['resolved', 'wall-function', 'wall-model', 'blended', 'rough-wall-function'] as const
export type WallTreatment = (typeof WALL_TREATMENTS)[number]

/** Each treatment named by its published method, in our words. */
export const WALL_TREATMENT_LABELS: Readonly<Record<WallTreatment, string>> = {
  resolved: 'Resolved viscous sublayer (first cell at y+ ≤ 1)',
  'wall-function': 'Log-law wall functions (Launder & Spalding 1974)',
  'wall-model': 'Equilibrium wall-stress model matched at 0.1 δ (Kawai & Larsson 2012)',
  blended: "Blended law of the wall for any first-cell y+ (Spalding 1961; Popovac & Hanjalić 2007)",
  'rough-wall-function': 'Rough-wall log-law functions with a sand-grain shift (Nikuradse 1933; Cebeci & Bradshaw 1977)',
}

/** The model of a direct simulation: there is none. */
export const NO_TURBULENCE_MODEL = 'none (direct solution of the Navier-Stokes equations)'
/** The model of a laminar solution. */
export const LAMINAR_MODEL = 'none (laminar Navier-Stokes solution)'

const EDDY_VISCOSITY_AND_STRESS_MODELS = [
  'k-omega SST',
  'Spalart-Allmaras',
  'k-omega SST with rotation-curvature correction',
  'Spalart-Allmaras with rotation-curvature correction (SA-RC)',
  'k-omega SST with gamma-Re-theta transition',
  'SSG/LRR-omega Reynolds-stress model',
  'realizable k-epsilon',
] as const

/** Published model names a reviewer may choose from, per approach; the first is the default. */
export const MODELS_BY_APPROACH: Readonly<Record<ApproachId, readonly string[]>> = {
  dns: [NO_TURBULENCE_MODEL],
  wrles: ['WALE', 'dynamic Smagorinsky', 'Vreman', 'sigma'],
  wmles: ['WALE', 'dynamic Smagorinsky', 'Vreman', 'sigma'],
  hybrid: ['IDDES', 'DDES', 'DES97'],
  urans: [...EDDY_VISCOSITY_AND_STRESS_MODELS],
  rans: [...EDDY_VISCOSITY_AND_STRESS_MODELS, 'standard k-epsilon'],
  laminar: [LAMINAR_MODEL],
}

/** Where each model was published, for the advice's explanations (citations from memory; check before quoting). */
export const MODEL_REFERENCES: Readonly<Record<string, string>> = {
  [NO_TURBULENCE_MODEL]: 'Moin & Mahesh 1998, Annu. Rev. Fluid Mech. 30, 539 (review of DNS)',
  [LAMINAR_MODEL]: 'Navier-Stokes equations without a turbulence model; Williamson 1996, Annu. Rev. Fluid Mech. 28, 477 (laminar wakes)',
  WALE: 'Nicoud & Ducros 1999, Flow Turbul. Combust. 62, 183',
  'dynamic Smagorinsky': 'Germano et al. 1991, Phys. Fluids A 3, 1760; Lilly 1992, Phys. Fluids A 4, 633',
  Vreman: 'Vreman 2004, Phys. Fluids 16, 3670',
  sigma: 'Nicoud et al. 2011, Phys. Fluids 23, 085106',
  IDDES: 'Shur, Spalart, Strelets & Travin 2008, Int. J. Heat Fluid Flow 29, 1638',
  DDES: 'Spalart et al. 2006, Theor. Comput. Fluid Dyn. 20, 181',
  DES97: 'Spalart, Jou, Strelets & Allmaras 1997, Advances in DNS/LES',
  'k-omega SST': 'Menter 1994, AIAA J. 32, 1598',
  'Spalart-Allmaras': 'Spalart & Allmaras 1992, AIAA Paper 92-0439',
  'k-omega SST with rotation-curvature correction': 'Smirnov & Menter 2009, J. Turbomach. 131, 041010',
  'Spalart-Allmaras with rotation-curvature correction (SA-RC)': 'Spalart & Shur 1997, Aerosp. Sci. Technol. 1, 297',
  'k-omega SST with gamma-Re-theta transition': 'Langtry & Menter 2009, AIAA J. 47, 2894',
  'SSG/LRR-omega Reynolds-stress model': 'Eisfeld, Rumsey & Togiti 2016, AIAA J. 54, 1524 (from memory)',
  'realizable k-epsilon': 'Shih et al. 1995, Comput. Fluids 24, 227',
  'standard k-epsilon': 'Launder & Spalding 1974, Comput. Methods Appl. Mech. Eng. 3, 269',
}

/** The wall treatments each approach can use; the first is its default. */
export const WALL_TREATMENTS_BY_APPROACH: Readonly<Record<ApproachId, readonly WallTreatment[]>> = {
  dns: ['resolved'],
  wrles: ['resolved'],
  wmles: ['wall-model'],
  hybrid: ['resolved', 'blended', 'wall-function', 'rough-wall-function'],
  urans: ['resolved', 'blended', 'wall-function', 'rough-wall-function'],
  rans: ['resolved', 'blended', 'wall-function', 'rough-wall-function'],
  laminar: ['resolved'],
}

// Each approach's default is the first of its list; a fresh, writable record per call.
function firstOfEach<T>(lists: Record<ApproachId, readonly T[]>): Record<ApproachId, T> {
  const firsts = {} as Record<ApproachId, T>
  for (const id of APPROACH_IDS) firsts[id] = lists[id][0]!
  return firsts
}

export function defaultWallTreatments(): Record<ApproachId, WallTreatment> {
  return firstOfEach(WALL_TREATMENTS_BY_APPROACH)
}

export function defaultModels(): Record<ApproachId, string> {
  return firstOfEach(MODELS_BY_APPROACH)
}
