/**
 * Published canonical cases: each with the case as an engineer would enter it, the approach the
 * published study used, and its citation. Shared by the canonical-case test and the benchmark.
 * Velocities are set from the published Reynolds number with air at 20 °C (nu = 1.506e-5 m2/s) or
 * water at 20 °C (nu = 1.004e-6 m2/s).
 */
import type { ApproachId, CaseInputDraft, WallTreatment } from '#shared/rules/index'

const AIR_NU = 1.506e-5
const WATER_NU = 1.004e-6
/** Speed of sound in air at 20 °C, sqrt(1.4 x 287.05 x 293.15) = 343.2 m/s. */
const AIR_SOUND = 343.2

const air = { medium: 'air' as const }
const water = { medium: 'water' as const }

export interface CanonicalCase {
  name: string
  /** the published study or practice, and where it comes from */
  citation: string
  input: CaseInputDraft
  approach: ApproachId
  /** a fragment of the recommended model, when the study fixes one */
  model?: RegExp
  wallTreatment?: WallTreatment
}

const channel = (hydraulicDiameter: number, reynoldsHydraulic: number): Pick<CaseInputDraft, 'regime' | 'fluid' | 'length' | 'velocity' | 'geometry' | 'separation'> => ({
  regime: 'internal',
  fluid: air,
  length: hydraulicDiameter,
  velocity: (reynoldsHydraulic * AIR_NU) / hydraulicDiameter,
  geometry: 'duct',
  separation: 'none',
})

const pipe = (diameter: number, reynolds: number) => ({
  regime: 'internal' as const,
  fluid: water,
  length: diameter,
  velocity: (reynolds * WATER_NU) / diameter,
  geometry: 'duct' as const,
  separation: 'none' as const,
})

/** External air flow over a reference length `length` at Reynolds number `reynolds`. */
const external = (length: number, reynolds: number) => ({
  regime: 'external' as const,
  fluid: air,
  length,
  velocity: (reynolds * AIR_NU) / length,
})

/** External air flow at Mach number `mach` and Reynolds number `reynolds`: the length follows. */
const transonic = (mach: number, reynolds: number) => ({
  regime: 'external' as const,
  fluid: air,
  velocity: mach * AIR_SOUND,
  length: (reynolds * AIR_NU) / (mach * AIR_SOUND),
})

export const CANONICAL_CASES: CanonicalCase[] = [
  {
    name: 'plane channel DNS at Re_tau 180',
    citation: 'Kim, Moin & Moser 1987, JFM 177, 133 (DNS; Re_b = 5600 on 2h, Re_Dh = 11200)',
    input: { ...channel(0.04, 11200), domain: { crossSection: 'channel' }, quantities: ['statistics'], budget: { coreHours: 2e4, cores: 512, wallClockHours: 200 } },
    approach: 'dns',
  },
  {
    name: 'plane channel DNS at Re_tau 5200',
    citation: 'Lee & Moser 2015, JFM 774, 395 (DNS; Re_b = 125000 on 2h; 8 pi h x 2h x 3 pi h)',
    input: {
      ...channel(0.4, 250000),
      domain: { crossSection: 'channel', lengthRatio: 2 * Math.PI, span: 0.3 * Math.PI },
      quantities: ['statistics'],
      budget: { coreHours: 1e10, cores: 786432, wallClockHours: 2e4 },
    },
    approach: 'dns',
  },
  {
    name: 'pipe DNS at Re_tau 180',
    citation: 'Eggels et al. 1994, JFM 268, 175 (DNS at Re_D = 5300)',
    input: { ...pipe(0.05, 5300), quantities: ['statistics'], budget: { coreHours: 2e4, cores: 512, wallClockHours: 200 } },
    approach: 'dns',
  },
  {
    name: 'pipe DNS at Re_tau 1000',
    citation: 'El Khoury et al. 2013, Flow Turbul. Combust. 91, 475 (DNS at Re_D = 37700)',
    input: { ...pipe(0.1, 37700), domain: { lengthRatio: 12.5 }, quantities: ['statistics'], budget: { coreHours: 5e7, cores: 65536, wallClockHours: 2000 } },
    approach: 'dns',
  },
  {
    name: 'transitional pipe flow at Re_D 3000 (puffs)',
    citation: 'Avila et al. 2011, Science 333, 192 (DNS of puffs between Re_D 2000 and 3000)',
    input: { ...pipe(0.05, 3000), domain: { lengthRatio: 50 }, quantities: ['statistics'], budget: { coreHours: 5e4, cores: 512, wallClockHours: 200 } },
    approach: 'dns',
  },
  {
    name: 'circular cylinder at Re 100, laminar periodic shedding',
    citation: 'Williamson 1996, Annu. Rev. Fluid Mech. 28, 477 (two-dimensional laminar shedding below Re 190)',
    input: {
      ...external(0.01, 100),
      geometry: 'bluff',
      separation: 'massive',
      domain: { dimensions: '2d' },
      quantities: ['forces', 'unsteady-loads'],
      budget: { coreHours: 500, cores: 32, wallClockHours: 24 },
    },
    approach: 'laminar',
  },
  {
    name: 'circular cylinder at Re 3900, subcritical',
    citation: 'Kravchenko & Moin 2000, Phys. Fluids 12, 403 (wall-resolved LES, span pi D)',
    input: {
      ...external(0.01, 3900),
      geometry: 'bluff',
      separation: 'massive',
      domain: { dimensions: '2d' },
      quantities: ['statistics'],
      budget: { coreHours: 2e4, cores: 512, wallClockHours: 200 },
    },
    approach: 'wrles',
    wallTreatment: 'resolved',
  },
  {
    name: 'NACA 0012 at Re 6e6, attached',
    citation: 'NASA Turbulence Modeling Resource 2-D NACA 0012 validation case (Rumsey; data of Ladson 1988, NASA TM-4074): steady RANS, SA and SST, first cell at y+ < 1',
    input: { ...external(1, 6e6), geometry: 'streamlined', separation: 'none', domain: { dimensions: '2d' }, quantities: ['forces', 'pressure'], budget: { coreHours: 500, cores: 64, wallClockHours: 24 } },
    approach: 'rans',
    model: /SST|Spalart/,
    wallTreatment: 'resolved',
  },
  {
    name: 'flat plate at Re_L 1e7',
    citation: 'NASA Turbulence Modeling Resource 2-D zero-pressure-gradient flat plate verification case (Rumsey): steady RANS, resolved wall',
    input: { ...external(2, 1e7), geometry: 'streamlined', separation: 'none', domain: { dimensions: '2d' }, quantities: ['forces'], budget: { coreHours: 200, cores: 32, wallClockHours: 24 } },
    approach: 'rans',
    wallTreatment: 'resolved',
  },
  {
    name: 'RAE 2822 case 9, transonic and attached',
    citation: 'Cook, McDonald & Firmin 1979, AGARD AR-138 (M 0.73, Re 6.5e6); steady RANS with resolved wall as in the NPARC validation archive (from memory)',
    input: { ...transonic(0.73, 6.5e6), geometry: 'streamlined', separation: 'none', domain: { dimensions: '2d' }, quantities: ['forces', 'pressure'], budget: { coreHours: 500, cores: 64, wallClockHours: 24 } },
    approach: 'rans',
    wallTreatment: 'resolved',
  },
  {
    name: 'OAT15A transonic buffet, large budget',
    citation: 'Deck 2005, AIAA J. 43, 1556 (zonal DES of the OAT15A buffet at M 0.73, Re 3e6; experiment Jacquin et al. 2009)',
    input: {
      ...transonic(0.73, 3e6),
      geometry: 'streamlined',
      separation: 'mild',
      domain: { dimensions: 'span-periodic' },
      quantities: ['unsteady-loads'],
      budget: { coreHours: 1e6, cores: 4096, wallClockHours: 500 },
    },
    approach: 'hybrid',
  },
  {
    name: 'NACA 0012 transonic buffet, modest budget',
    citation: 'Iovnovich & Raveh 2012, AIAA J. 50, 880 (URANS of shock buffet; experiment McDevitt & Okuno 1985 at M 0.775, Re 1e7)',
    input: { ...transonic(0.775, 1e7), geometry: 'streamlined', separation: 'mild', domain: { dimensions: '2d' }, quantities: ['unsteady-loads'], budget: { coreHours: 2000, cores: 128, wallClockHours: 48 } },
    approach: 'urans',
  },
  {
    name: 'Ahmed body, 35 degree slant, large budget',
    citation: 'Guilmineau et al. 2018, Comput. Fluids 176, 302 (DDES and IDDES of the Ahmed body; body of Ahmed, Ramm & Faltin 1984, SAE 840300, 40 m/s on 1.044 m)',
    input: { regime: 'external', fluid: air, velocity: 40, length: 1.044, geometry: 'bluff', separation: 'massive', quantities: ['forces', 'pressure'], budget: { coreHours: 2e5, cores: 2048, wallClockHours: 300 } },
    approach: 'hybrid',
  },
  {
    name: 'Ahmed body, 35 degree slant, modest budget',
    citation: 'Guilmineau 2008, J. Wind Eng. Ind. Aerodyn. 96, 1207 (steady RANS of the Ahmed body; from memory)',
    input: { regime: 'external', fluid: air, velocity: 40, length: 1.044, geometry: 'bluff', separation: 'massive', quantities: ['forces', 'pressure'], budget: { coreHours: 2000, cores: 256, wallClockHours: 48 } },
    approach: 'rans',
  },
  {
    name: 'high-rise building in the atmospheric boundary layer, mean pressures',
    citation: 'Tominaga et al. 2008, J. Wind Eng. Ind. Aerodyn. 96, 1749 (AIJ guidelines: steady RANS, revised k-epsilon, rough ground); Franke et al. 2007, COST 732 guideline',
    input: {
      regime: 'external',
      fluid: air,
      velocity: 10,
      length: 100,
      roughnessLength: 0.3,
      geometry: 'complex',
      separation: 'massive',
      quantities: ['pressure'],
      budget: { coreHours: 2e4, cores: 256, wallClockHours: 100 },
    },
    approach: 'rans',
    model: /realizable k-epsilon/,
    wallTreatment: 'rough-wall-function',
  },
  {
    name: 'high-rise building in the atmospheric boundary layer, peak loads',
    citation: 'Tamura 2008, J. Wind Eng. Ind. Aerodyn. 96, 1974 (LES with wall functions and generated inflow turbulence for peak wind loads)',
    input: {
      regime: 'external',
      fluid: air,
      velocity: 10,
      length: 100,
      roughnessLength: 0.3,
      geometry: 'complex',
      separation: 'massive',
      quantities: ['unsteady-loads', 'pressure'],
      budget: { coreHours: 1e6, cores: 4096, wallClockHours: 500 },
    },
    approach: 'wmles',
  },
  {
    name: 'ventilated room, IEA Annex 20 test case',
    citation: 'Nielsen 1990, IEA Annex 20 two-dimensional test case (room 9 m x 3 m, inlet 0.455 m/s); Zhang, Zhai, Chen et al. 2007, HVAC&R Res. 13, 871 (RANS k-epsilon family)',
    input: {
      regime: 'internal',
      fluid: air,
      velocity: 0.455,
      length: 3,
      geometry: 'complex',
      separation: 'massive',
      domain: { dimensions: '2d', lengthRatio: 3, crossSection: 'duct' },
      quantities: ['mixing', 'pressure'],
      budget: { coreHours: 500, cores: 32, wallClockHours: 24 },
    },
    approach: 'rans',
    model: /k-epsilon/,
  },
  {
    name: 'gas cyclone',
    citation: 'Hoekstra, Derksen & Van den Akker 1999, Chem. Eng. Sci. 54, 2055 (Reynolds-stress model needed for the swirl; D = 0.29 m)',
    input: {
      regime: 'internal',
      fluid: air,
      velocity: 15,
      length: 0.29,
      geometry: 'complex',
      separation: 'none',
      physics: { rotation: true },
      quantities: ['pressure'],
      budget: { coreHours: 3000, cores: 128, wallClockHours: 48 },
    },
    approach: 'rans',
    model: /Reynolds-stress/,
  },
  {
    name: 'container ship hull at full scale',
    citation: 'ITTC 2011 Recommended Procedure 7.5-03-03-01 and the Lloyd’s Register 2016 full-scale workshop (steady RANS with rough-wall functions; from memory)',
    input: {
      regime: 'external',
      fluid: water,
      velocity: 12.35,
      length: 230,
      roughness: 150e-6,
      geometry: 'streamlined',
      separation: 'none',
      quantities: ['forces'],
      budget: { coreHours: 2e4, cores: 512, wallClockHours: 100 },
    },
    approach: 'rans',
  },
  {
    name: 'periodic hill at Re_h 10595',
    citation: 'Fröhlich et al. 2005, JFM 526, 19 and Breuer et al. 2009, Comput. Fluids 38, 433 (wall-resolved LES; channel height 3.036 h, 9 h x 4.5 h box)',
    input: {
      ...channel(0.0607, 64300),
      separation: 'massive',
      domain: { crossSection: 'channel', lengthRatio: 9 / 6.07, span: 0.045 },
      quantities: ['statistics'],
      budget: { coreHours: 1e5, cores: 1024, wallClockHours: 300 },
    },
    approach: 'wrles',
  },
  {
    name: 'round jet impinging on a heated plate',
    citation: 'Behnia, Parneix & Durbin 1998, Int. J. Heat Mass Transfer 41, 1845 (RANS integrated to the wall; experiment Baughn & Shimizu 1989 at Re 23750)',
    input: {
      regime: 'internal',
      fluid: air,
      velocity: (23750 * AIR_NU) / 0.0254,
      length: 0.0254,
      geometry: 'complex',
      separation: 'none',
      physics: { heatTransfer: true },
      domain: { dimensions: 'axisymmetric' },
      quantities: ['heat-transfer'],
      budget: { coreHours: 200, cores: 32, wallClockHours: 24 },
    },
    approach: 'rans',
    wallTreatment: 'resolved',
  },
  {
    name: 'NASA Rotor 37 transonic compressor',
    citation: 'Denton 1997, J. Turbomach. 119, 193 (steady RANS of Rotor 37 with resolved walls)',
    input: { regime: 'external', fluid: air, velocity: 480, length: 0.056, geometry: 'rotating', separation: 'mild', quantities: ['pressure'], budget: { coreHours: 5000, cores: 256, wallClockHours: 48 } },
    approach: 'rans',
    wallTreatment: 'resolved',
  },
  {
    name: 'SD7003 aerofoil at Re 6e4, laminar separation bubble, statistics',
    citation: 'Galbraith & Visbal 2008, AIAA Paper 2008-225 (implicit LES resolving the wall, span 0.2 c)',
    input: {
      ...external(0.2, 6e4),
      geometry: 'streamlined',
      separation: 'mild',
      domain: { dimensions: 'span-periodic' },
      quantities: ['statistics'],
      budget: { coreHours: 5e4, cores: 1024, wallClockHours: 200 },
    },
    approach: 'wrles',
  },
  {
    name: 'SD7003 aerofoil at Re 6e4, forces on a small budget',
    citation: 'Catalano & Tognaccini 2011, Aerosp. Sci. Technol. 15, 615 (RANS with a transition model for the SD7003)',
    input: { ...external(0.2, 6e4), geometry: 'streamlined', separation: 'mild', domain: { dimensions: '2d' }, quantities: ['forces'], budget: { coreHours: 100, cores: 32, wallClockHours: 24 } },
    approach: 'rans',
    model: /transition/,
  },
  {
    name: 'plane channel at Re_tau 5200 on an LES budget',
    citation: 'Kawai & Larsson 2012, Phys. Fluids 24, 015105 (wall-modelled LES of high-Reynolds-number channel and boundary-layer flow)',
    input: {
      ...channel(0.4, 250000),
      domain: { crossSection: 'channel', lengthRatio: 2 * Math.PI, span: 0.3 * Math.PI },
      quantities: ['statistics'],
      budget: { coreHours: 2e4, cores: 1024, wallClockHours: 200 },
    },
    approach: 'wmles',
  },
  {
    name: 'Mach 0.9 round jet noise',
    citation: 'Brès et al. 2018, JFM 851, 83 (LES with wall modelling in the nozzle, Re_D 1e6, far-field noise)',
    input: {
      regime: 'external',
      fluid: air,
      velocity: 0.9 * AIR_SOUND,
      length: 0.05,
      geometry: 'complex',
      separation: 'massive',
      application: 'jet',
      quantities: ['noise'],
      budget: { coreHours: 5e6, cores: 16384, wallClockHours: 1000 },
    },
    approach: 'wmles',
  },
]
