/**
 * Scoring-stage rules: how the case's physics and costs move the score of each approach, choose the
 * models and add cautions. Rules that read costs do so smoothly (log10 of the budget ratio), so a
 * small change of budget moves a score only a little.
 */
import type { RulesetSource } from './ruleset-schema'
import { heatTransferWanted } from './ruleset-treatment'

type RuleSource = RulesetSource['rules'][number]

const unsteadyWanted = {
  or: [{ in: ['unsteady-loads', { var: 'quantities' }] }, { in: ['noise', { var: 'quantities' }] }, { var: 'physics.acoustics' }],
}
const noiseWanted = { or: [{ in: ['noise', { var: 'quantities' }] }, { var: 'physics.acoustics' }] }
const statisticsWanted = { in: ['statistics', { var: 'quantities' }] }
const ALL = ['dns', 'wrles', 'wmles', 'hybrid', 'urans', 'rans', 'laminar'] as const

/** -50 points per decade over budget, none within it: max(-60, min(0, -50 log10 r)). */
function budgetTerm(approach: string) {
  return { max: [-60, { min: [0, { '*': [-50, { var: `budgetLog.${approach}` }] }] }] }
}

/** A bonus of `slope` points per decade below a tenth of the budget, up to `cap`. */
function headroomBonus(approach: string, slope: number, cap: number) {
  return { max: [0, { min: [cap, { '-': [{ '*': [-slope, { var: `budgetLog.${approach}` }] }, slope] }] }] }
}

const REGIME_RULES: RuleSource[] = [
  {
    id: 'laminar-flow-needs-no-model',
    title: 'Laminar flow: solve it without a turbulence model',
    stage: 'scoring',
    when: { '==': [{ var: 'flowState' }, 'laminar'] },
    effects: {
      scores: { laminar: 40, dns: -10, wrles: -40, wmles: -60, hybrid: -60, urans: -50, rans: -50 },
      cautions: [
        'Laminar flow: solve the Navier-Stokes equations without a turbulence model; a turbulence model would add eddy viscosity the flow does not have. Below Re ≈ 190 a cylinder wake stays two-dimensional, so a 2-D section suffices (Williamson 1996); check the Reynolds number against the regime thresholds shown.',
      ],
    },
    why:
      'Below the published thresholds (pipe Re_D ≈ 2300, aerofoil chord Reynolds number ≈ 3e4, cylinder wake Re ≈ 190) disturbances decay or stay laminar and periodic. ' +
      'The laminar equations are then exact, the mesh needs only to resolve the laminar layers and the wake, and a turbulence model can only do harm.',
    source: 'Reynolds 1883, Phil. Trans. R. Soc. 174, 935; Williamson 1996, Annu. Rev. Fluid Mech. 28, 477; Carmichael 1981, NASA CR-165803 (from memory)',
  },
  {
    id: 'transitional-flow-needs-transition-aware-methods',
    title: 'Transitional flow: a method that can follow transition',
    stage: 'scoring',
    when: { '==': [{ var: 'flowState' }, 'transitional'] },
    effects: {
      scores: { dns: 15, wrles: 15, laminar: 10, rans: 5, wmles: -40, hybrid: -25 },
      models: { rans: 'k-omega SST with gamma-Re-theta transition', urans: 'k-omega SST with gamma-Re-theta transition' },
      cautions: [
        'Transitional Reynolds number: the flow is neither reliably laminar nor fully turbulent (pipe puffs and slugs, laminar separation bubbles, a wake turning three-dimensional). Use a method that follows transition (DNS, wall-resolved LES, or RANS with a transition model), set the inflow disturbances as in the test or in service, and compare with a laminar and a fully turbulent bound.',
      ],
    },
    why:
      'Between the laminar and turbulent thresholds, the result hangs on where and whether the flow turns turbulent. ' +
      'Fully turbulent RANS assumes it is turbulent everywhere and wall models and shielded hybrids assume a turbulent boundary layer; DNS and wall-resolved LES follow transition, and correlation-based transition models let RANS find it.',
    source: 'Avila et al. 2011, Science 333, 192 (pipe); Langtry & Menter 2009, AIAA J. 47, 2894; Williamson 1996 (wake)',
  },
  {
    id: 'subcritical-bluff-body',
    title: 'Laminar separation, turbulent wake: resolve the wall and the shear layers',
    stage: 'scoring',
    when: { and: [{ '==': [{ var: 'wakeState' }, 'turbulent'] }, { '==': [{ var: 'boundaryLayerState' }, 'laminar'] }] },
    effects: {
      scores: { wrles: 20, dns: 5, wmles: -30, hybrid: -5, urans: -10, rans: -15 },
      cautions: [
        'Subcritical bluff body: the boundary layer separates laminar and the separated shear layers turn turbulent in the wake. RANS and wall models assume a turbulent boundary layer and misplace separation; resolve the wall and the shear layers, and check the span and the averaging time of the statistics.',
      ],
    },
    why:
      'Below the drag crisis the boundary layer on a bluff body is laminar up to separation, and the wake, formation length and drag are set by the transition of the free shear layers. ' +
      'Wall-resolved LES captures both at modest cost, as the published LES of the cylinder at Re 3900 show; URANS over-predicts the drag.',
    source: 'Kravchenko & Moin 2000, Phys. Fluids 12, 403; Breuer 1998, Int. J. Numer. Methods Fluids 28, 1281; Williamson 1996 (from memory)',
  },
  {
    id: 'drag-crisis',
    title: 'Drag crisis: the boundary layer turns turbulent near separation',
    stage: 'scoring',
    when: { and: [{ '==': [{ var: 'boundaryLayerState' }, 'transitional'] }, { '!=': [{ var: 'wakeState' }, 'none'] }] },
    effects: {
      cautions: [
        'Drag crisis (Re ≈ 2e5-5e5 for a circular cylinder): separation, drag and shedding depend on where the boundary layer turns turbulent, which surface roughness and free-stream turbulence move. Expect a wide spread between methods and treat the inflow turbulence as an input to vary.',
      ],
    },
    why: 'In the critical range the boundary layer transitions close to separation, separation moves aft and the drag drops sharply; the outcome is sensitive to roughness and inflow turbulence.',
    source: 'Achenbach 1968, JFM 34, 625; Roshko 1961, JFM 10, 345 (from memory)',
  },
]

const SEPARATION_RULES: RuleSource[] = [
  {
    id: 'attached-boundary-layers-suit-rans',
    title: 'Attached boundary layers suit steady RANS',
    stage: 'scoring',
    when: { '==': [{ var: 'separation' }, 'none'] },
    effects: { scores: { rans: 25, urans: -5, hybrid: -10 } },
    why:
      'RANS models are calibrated on attached wall-bounded flows, and there they predict skin friction and pressure reliably at a small fraction of the cost of resolving the eddies. ' +
      'Without separation there is little unsteadiness to capture; a hybrid method would run as RANS in the boundary layers anyway, and its switch can misbehave on grids whose wall-parallel spacing is of the order of the boundary-layer thickness.',
    source: 'Rumsey & Jeyapaul 2012; Slotnick et al. 2014, NASA/CR-2014-218178; Spalart et al. 2006, Theor. Comput. Fluid Dyn. 20, 181',
  },
  {
    id: 'attached-aerodynamics-sst',
    title: 'Attached external aerodynamics: k-omega SST, with Spalart-Allmaras as the second opinion',
    stage: 'scoring',
    when: {
      and: [{ '==': [{ var: 'regime' }, 'external'] }, { in: [{ var: 'geometry' }, ['streamlined', 'rotating']] }, { '!=': [{ var: 'separation' }, 'massive'] }],
    },
    effects: { scores: { rans: 5 }, models: { rans: 'k-omega SST', urans: 'k-omega SST' } },
    why:
      'For wings, aerofoils and blades both k-omega SST and Spalart-Allmaras are standard, and both are verified on the published flat-plate and aerofoil cases. ' +
      'SST limits the shear stress in adverse pressure gradients, which helps as separation approaches; run Spalart-Allmaras as the second opinion.',
    source: 'Menter 1994, AIAA J. 32, 1598; Spalart & Allmaras 1992, AIAA Paper 92-0439; NASA Turbulence Modeling Resource (Rumsey, from memory)',
  },
  {
    id: 'mild-separation',
    title: 'Mild separation: RANS with an adverse-pressure-gradient model, compared',
    stage: 'scoring',
    when: { '==': [{ var: 'separation' }, 'mild'] },
    effects: {
      scores: { rans: 10, hybrid: 5, wmles: 5 },
      models: { rans: 'k-omega SST', urans: 'k-omega SST' },
      cautions: [
        'Mild separation: the onset and extent of separation differ between RANS models; run at least two (for example k-omega SST and Spalart-Allmaras) and treat the spread as part of the uncertainty.',
      ],
    },
    why:
      'Small separated regions are within reach of RANS, and k-omega SST limits the shear stress in adverse pressure gradients for that purpose. ' +
      'Its predictions of where separation starts and ends are still the weak point, so the result deserves a second model.',
    source: 'Menter 1994, AIAA J. 32, 1598; Rumsey & Jeyapaul 2012',
  },
  {
    id: 'massive-separation-favours-resolving',
    title: 'Massive separation favours resolving the separated eddies',
    stage: 'scoring',
    when: { '==': [{ var: 'separation' }, 'massive'] },
    effects: {
      scores: { rans: -20, hybrid: 25, wmles: 15, wrles: 5 },
      cautions: [
        'Massive separation: with a hybrid method keep the boundary layers shielded (DDES or IDDES), make the cells nearly isotropic in the separated region, and check that resolved turbulence appears early in the separated shear layers.',
      ],
    },
    why:
      'In massively separated flow the large eddies carry most of the momentum exchange and they depend on the geometry, which no RANS calibration captures. ' +
      'Hybrid RANS-LES keeps RANS in the attached boundary layers and resolves the separated region, which suits high Reynolds numbers; ' +
      'wall-modelled LES resolves more of the flow at a higher cost.',
    source: 'Spalart 2009, Annu. Rev. Fluid Mech. 41, 181; Menter et al. 2021, Appl. Sci. 11, 2459',
  },
  {
    id: 'bluff-bodies-shed-vortices',
    title: 'Bluff bodies shed vortices',
    stage: 'scoring',
    when: { '==': [{ var: 'geometry' }, 'bluff'] },
    effects: { scores: { rans: -5, urans: 5, hybrid: 5 } },
    why:
      'Flow behind a bluff body separates at its edges and sheds vortices periodically; a steady solution averages that away, and the time-averaged wake it predicts is often too long.',
    source: 'Rodi 1997, J. Wind Eng. Ind. Aerodyn. 69-71, 55 (from memory)',
  },
  {
    id: 'planar-shedding-suits-urans',
    title: 'Two-dimensional shedding: URANS captures the dominant period',
    stage: 'scoring',
    when: {
      and: [
        { in: [{ var: 'dimensions' }, ['2d', 'span-periodic', 'axisymmetric']] },
        { in: [{ var: 'geometry' }, ['bluff', 'complex']] },
        { '==': [{ var: 'separation' }, 'massive'] },
        { in: [{ var: 'wakeState' }, ['turbulent', 'three-dimensional']] },
      ],
    },
    effects: { scores: { urans: 10 } },
    why:
      'Behind a two-dimensional body the shedding is a strong global instability: steady RANS often fails to converge, while URANS follows the dominant period at RANS cost. ' +
      'Its broadband content and peak values remain modelled.',
    source: 'Menter et al. 2021, Appl. Sci. 11, 2459; Rodi 1997, J. Wind Eng. Ind. Aerodyn. 69-71, 55 (from memory)',
  },
  {
    id: 'mean-values-of-three-dimensional-bodies',
    title: 'Mean values of a three-dimensional body: URANS adds cost without a return',
    stage: 'scoring',
    when: {
      and: [
        { '==': [{ var: 'dimensions' }, '3d'] },
        { '!=': [{ var: 'separation' }, 'none'] },
        { '!': unsteadyWanted },
        { '!': statisticsWanted },
      ],
    },
    effects: { scores: { urans: -15 } },
    why:
      'Around three-dimensional bodies the separated flow rarely locks into one period, and URANS tends to settle on a near-steady solution with the weaknesses of steady RANS at many times its cost. ' +
      'When only mean forces or pressures are wanted, steady RANS or a hybrid method is the better use of the budget.',
    source: 'Menter et al. 2021, Appl. Sci. 11, 2459; Spalart 2000, Int. J. Heat Fluid Flow 21, 252 (from memory)',
  },
]

const QUANTITY_RULES: RuleSource[] = [
  {
    id: 'unsteady-quantities-need-unsteady-methods',
    title: 'Unsteady loads or noise need a time-resolved method',
    stage: 'scoring',
    when: unsteadyWanted,
    effects: { scores: { rans: -30, urans: 5, hybrid: 15, wmles: 15, wrles: 10, dns: 5 } },
    why:
      'A steady RANS result has no fluctuations, so peak loads, fatigue spectra and acoustic sources are not in it. ' +
      'URANS captures deterministic unsteadiness such as regular shedding; the broadband part needs the eddies resolved.',
    source: 'Menter et al. 2021, Appl. Sci. 11, 2459',
  },
  {
    id: 'broadband-noise-needs-resolved-turbulence',
    title: 'Broadband noise needs resolved turbulence',
    stage: 'scoring',
    when: noiseWanted,
    effects: {
      scores: { urans: -15, rans: -10, hybrid: -5, wmles: 10, wrles: 5 },
      cautions: [
        'Noise: the cell size and time step set the highest frequency resolved; size them for the band you need, and carry the sources to the listener with an acoustic analogy (for example Ffowcs Williams-Hawkings) rather than through the CFD mesh.',
      ],
    },
    why:
      'Broadband noise comes from the turbulent eddies themselves. URANS returns only the tonal, deterministic part of the sources, and steady RANS none. ' +
      'Hybrid methods delay the growth of resolved turbulence in shear layers that leave a RANS region (the grey area), which costs them high-frequency content; LES does not have that delay.',
    source: 'Ffowcs Williams & Hawkings 1969, Phil. Trans. R. Soc. A 264, 321; Menter et al. 2021, Appl. Sci. 11, 2459; Brès et al. 2018, JFM 851, 83 (from memory)',
  },
  {
    id: 'turbulence-statistics-need-resolved-eddies',
    title: 'Turbulence statistics need resolved eddies',
    stage: 'scoring',
    when: statisticsWanted,
    effects: { scores: { rans: -25, urans: -20, hybrid: -5, wmles: 5, wrles: 20, dns: 20 } },
    why:
      'Reynolds stresses, spectra and higher moments come out of a simulation only for the eddies it resolves. ' +
      'DNS resolves them all; wall-resolved LES all but the smallest, which carry little of the stresses; RANS models them entirely and has none to report.',
    source: 'Pope, Turbulent Flows 2000; Moin & Mahesh 1998, Annu. Rev. Fluid Mech. 30, 539',
  },
  {
    id: 'canonical-internal-flow-dns',
    title: 'Statistics of a low-Reynolds-number internal flow: DNS is within reach',
    stage: 'scoring',
    when: {
      and: [statisticsWanted, { '==': [{ var: 'regime' }, 'internal'] }, { '==': [{ var: 'flowState' }, 'turbulent'] }, { '<': [{ var: 'deltaPlus' }, 1100] }],
    },
    effects: { scores: { dns: 10 } },
    why:
      'Channels, pipes and steps at friction Reynolds numbers up to about a thousand are the home of DNS: the periodic domain is small, the wall units are large, and the DNS data sets that models are judged against come from exactly these runs.',
    source: 'Kim, Moin & Moser 1987, JFM 177, 133; Le, Moin & Kim 1997, JFM 330, 349; El Khoury et al. 2013, Flow Turbul. Combust. 91, 475',
  },
  {
    id: 'turbulent-mixing',
    title: 'Turbulent mixing is carried by the large eddies',
    stage: 'scoring',
    when: { in: ['mixing', { var: 'quantities' }] },
    effects: { scores: { rans: -10, urans: -5, hybrid: 10, wmles: 10, wrles: 5 } },
    why:
      'Mixing in jets, wakes and shear layers is done by large, unsteady eddies; RANS represents it by gradient diffusion with a tuned turbulent Schmidt or Prandtl number, and the fluctuations that drive thermal fatigue are absent.',
    source: 'Menter et al. 2021, Appl. Sci. 11, 2459',
  },
  {
    id: 'heat-transfer-model',
    title: 'Heat transfer: a two-equation model integrated to the wall',
    stage: 'scoring',
    when: heatTransferWanted,
    effects: { scores: { wmles: -10, wrles: 5 }, models: { rans: 'k-omega SST', urans: 'k-omega SST' } },
    why:
      'k-omega SST integrates to the wall without damping functions and is a common choice for wall heat transfer. ' +
      'Wall models for the heat flux in LES are less mature than those for the shear stress, which counts against wall-modelled LES.',
    source: 'Menter 1994, AIAA J. 32, 1598; Larsson et al. 2016, Mech. Eng. Rev. 3 (from memory)',
  },
]

const PHYSICS_RULES: RuleSource[] = [
  {
    id: 'rotation-and-curvature',
    title: 'Rotation or curvature: a curvature-corrected model',
    stage: 'scoring',
    when: { '==': [{ var: 'swirl' }, 'weak'] },
    effects: {
      scores: { urans: 5 },
      models: { rans: 'k-omega SST with rotation-curvature correction', urans: 'k-omega SST with rotation-curvature correction' },
      cautions: [
        'Rotation or curvature: eddy-viscosity models do not feel how rotation and streamline curvature damp or amplify turbulence; the curvature correction helps, but compare with a Reynolds-stress model before trusting swirl decay, vortex cores or separation.',
      ],
    },
    why:
      'System rotation and streamline curvature change the turbulence in ways an isotropic eddy viscosity cannot represent. ' +
      'A rotation-curvature correction sensitises the model to them, which is the usual practice in turbomachinery.',
    source: 'Smirnov & Menter 2009, J. Turbomach. 131, 041010; Spalart & Shur 1997, Aerosp. Sci. Technol. 1, 297',
  },
  {
    id: 'strong-swirl-needs-reynolds-stress-model',
    title: 'Strong swirl: a Reynolds-stress model at the least',
    stage: 'scoring',
    when: { '==': [{ var: 'swirl' }, 'strong'] },
    effects: {
      scores: { rans: 10, urans: 10, hybrid: -5 },
      models: { rans: 'SSG/LRR-omega Reynolds-stress model', urans: 'SSG/LRR-omega Reynolds-stress model' },
      cautions: [
        'Strong swirl (cyclones, swirl burners, vortex breakdown): two-equation models give a forced-vortex core and wrong tangential velocity; use a Reynolds-stress model at the least, and an unsteady run where the vortex core precesses.',
      ],
    },
    why:
      'In strongly swirling flow the turbulence is far from isotropic and the stresses respond to rotation through their own transport; an eddy viscosity, even corrected, turns the free vortex of a cyclone into a solid-body one. ' +
      'Reynolds-stress models carry those effects in their equations and are the published minimum; LES is the reference where the budget allows.',
    source: 'Hoekstra, Derksen & Van den Akker 1999, Chem. Eng. Sci. 54, 2055; Gupta, Lilley & Syred 1984, Swirl Flows (from memory)',
  },
  {
    id: 'laminar-turbulent-transition',
    title: 'Laminar-turbulent transition marked: a transition model',
    stage: 'scoring',
    when: { and: [{ var: 'physics.transition' }, { '==': [{ var: 'flowState' }, 'turbulent'] }] },
    effects: {
      scores: { wmles: -25, hybrid: -10, wrles: 10, dns: 5 },
      models: { rans: 'k-omega SST with gamma-Re-theta transition', urans: 'k-omega SST with gamma-Re-theta transition' },
      cautions: [
        'Transition: set the free-stream turbulence intensity and its decay up to the body as in the test or in service, refine the streamwise spacing where transition is expected, and compare with a fully turbulent run.',
      ],
    },
    why:
      'Where transition moves with the flow conditions, a correlation-based transition model lets the RANS solution find it. ' +
      'Wall models and shielded hybrid methods assume a turbulent boundary layer from the start; wall-resolved LES and DNS can follow transition itself if the inflow disturbances are right.',
    source: 'Langtry & Menter 2009, AIAA J. 47, 2894',
  },
  {
    id: 'buoyancy',
    title: 'Buoyancy changes the turbulence',
    stage: 'scoring',
    when: { var: 'physics.buoyancy' },
    effects: {
      scores: { urans: 5 },
      cautions: [
        'Buoyancy: include buoyancy production in the turbulence equations, check whether the flow is driven by buoyancy (Richardson number), and expect stable stratification to need a Reynolds-stress model or a scale-resolving method.',
      ],
    },
    why:
      'Buoyancy produces or destroys turbulence depending on the stratification, and buoyant plumes are often unsteady, which favours a time-resolved solution.',
    source: 'common practice, no source',
  },
]

const APPLICATION_RULES: RuleSource[] = [
  {
    id: 'atmospheric-flows-realizable-k-epsilon',
    title: 'Wind around buildings: steady RANS with realizable k-epsilon for mean values',
    stage: 'scoring',
    when: { '==': [{ var: 'application' }, 'atmospheric'] },
    effects: {
      scores: { rans: 40, urans: -10, hybrid: -20, wmles: -10 },
      models: { rans: 'realizable k-epsilon', urans: 'realizable k-epsilon' },
      cautions: [
        'Atmospheric boundary layer: prescribe inflow profiles of velocity and turbulence consistent with the ground roughness and the rough-wall function, check that they stay horizontally homogeneous through an empty domain, and size the domain from the building height (5 H upstream and sideways, 15 H downstream) as the published guidelines ask.',
      ],
    },
    why:
      'For mean wind speeds and pressures around buildings, the published guidelines recommend steady RANS with a revised k-epsilon model (realizable or RNG) and rough-wall functions on the ground, because they match wind-tunnel data well at a cost that allows the many wind directions a study needs. ' +
      'Hybrid methods are rarely used here, and LES is kept for what RANS cannot give (peak loads, dispersion): generating resolved inflow turbulence is a study of its own.',
    source: 'Franke et al. 2007, COST Action 732 Best Practice Guideline; Tominaga et al. 2008, J. Wind Eng. Ind. Aerodyn. 96, 1749; Blocken 2015, Build. Environ. 91, 219 (from memory)',
  },
  {
    id: 'peak-wind-loads-need-les',
    title: 'Peak wind loads need LES',
    stage: 'scoring',
    when: { and: [{ '==': [{ var: 'application' }, 'atmospheric'] }, unsteadyWanted] },
    effects: { scores: { wmles: 50, hybrid: 5 } },
    why:
      'Peak pressures and fluctuating loads on buildings come from the turbulence of the approaching wind and of the separated shear layers; RANS has neither. ' +
      'LES with wall functions and generated inflow turbulence is the published method for them.',
    source: 'Tamura 2008, J. Wind Eng. Ind. Aerodyn. 96, 1974; Blocken 2015, Build. Environ. 91, 219 (from memory)',
  },
  {
    id: 'indoor-air-realizable-k-epsilon',
    title: 'Room air flow: steady RANS with realizable k-epsilon',
    stage: 'scoring',
    when: { '==': [{ var: 'application' }, 'indoor'] },
    effects: {
      scores: { rans: 40, urans: -5, hybrid: -20 },
      models: { rans: 'realizable k-epsilon', urans: 'realizable k-epsilon' },
      cautions: [
        'Room air: model the supply devices (diffusers, slots) with care, since the jet they produce sets the flow in the room; include buoyancy where surfaces or occupants are heated, and compare with measured velocities before trusting comfort figures.',
      ],
    },
    why:
      'Ventilated rooms combine wall jets, recirculation and low velocities. Revised k-epsilon models with a blended or log-law wall treatment reproduce the mean velocity and temperature fields of the published benchmarks at a cost that allows design iterations; LES is the reference when fluctuations matter.',
    source: 'Nielsen 1990, IEA Annex 20 two-dimensional test case; Zhang, Zhai, Chen et al. 2007, HVAC&R Res. 13, 871 (from memory)',
  },
  {
    id: 'free-shear-flows-suit-les',
    title: 'Jets and mixing layers: LES of the shear layers',
    stage: 'scoring',
    when: { '==': [{ var: 'application' }, 'jet'] },
    effects: {
      scores: { wmles: 20, wrles: 10, hybrid: -10, rans: -10 },
      cautions: [
        'Jet or mixing layer: the state of the boundary layer at the nozzle lip sets the initial shear layer; resolve it or seed it with disturbances, and keep the mesh fine enough along the potential core for the frequencies wanted.',
      ],
    },
    why:
      'Free shear flows have no wall layer to pay for away from the nozzle: LES resolves the large eddies that carry mixing and radiate noise, and a wall model in the nozzle keeps its boundary layer affordable. ' +
      'Hybrid methods start the shear layer from a RANS state and develop resolved turbulence late, which shows in the spectra.',
    source: 'Brès et al. 2018, JFM 851, 83; Bodony & Lele 2008, AIAA J. 46, 364 (from memory)',
  },
  {
    id: 'ship-hulls',
    title: 'Ship hulls: steady RANS at model and full scale',
    stage: 'scoring',
    when: { '==': [{ var: 'application' }, 'marine'] },
    effects: {
      scores: { rans: 10 },
      cautions: [
        'Ship hull: resolve the free surface where waves matter, and at full scale include the hull roughness (an equivalent sand-grain height of about 100-150 micrometres for a new coated hull, ITTC practice, from memory); the friction line of the model-scale correlation does not apply to CFD at full scale.',
      ],
    },
    why:
      'Resistance and wake of ship hulls are predicted with steady RANS at model and full scale in the published workshops; at full-scale Reynolds numbers wall functions are the norm and roughness must be included.',
    source: 'Larsson, Stern & Visonneau 2014, Numerical Ship Hydrodynamics (Gothenburg 2010 workshop); ITTC 2011 Recommended Procedure 7.5-03-03-01 (from memory)',
  },
]

const COMPRESSIBILITY_RULES: RuleSource[] = [
  {
    id: 'compressibility',
    title: 'Compressible flow above Mach 0.3',
    stage: 'scoring',
    when: { '>=': [{ var: 'mach' }, 0.3] },
    effects: {
      cautions: [
        'Mach 0.3 and above: density changes exceed about 5%, so use a compressible solver. The wall figures use properties at Eckert\'s reference temperature (adiabatic wall unless a wall temperature is given); explicit compressible solvers pay an acoustic time-step factor of 1 + 1/M, included in the scale-resolving costs.',
      ],
    },
    why:
      'In isentropic flow the density drop reaches about 5% at Mach 0.3, the usual limit for treating a gas as incompressible; above it the viscosity and density in the boundary layer differ from the free stream.',
    source: 'Isentropic flow relations, e.g. Anderson, Modern Compressible Flow; Eckert 1955, J. Aeronaut. Sci. 22, 585 (from memory)',
  },
  {
    id: 'transonic-shocks',
    title: 'Transonic flow: shocks on the boundary layers',
    stage: 'scoring',
    when: { '==': [{ var: 'machRegime' }, 'transonic'] },
    effects: {
      cautions: [
        'Transonic: shocks stand on the surfaces; refine the mesh where they sit, use a shock-capturing scheme, and check the shock position against a finer mesh. Shock-induced separation is a known weakness of every RANS model; compare at least two.',
      ],
    },
    why: 'Between about Mach 0.7 and 1.2 local supersonic regions end in shocks whose position depends on the boundary layer they stand on, and the other way round.',
    source: 'Knight & Degrez 1998, AGARD AR-319; Anderson, Modern Compressible Flow (from memory)',
  },
  {
    id: 'transonic-buffet',
    title: 'Shock buffet: an unsteady method',
    stage: 'scoring',
    when: {
      and: [
        { '==': [{ var: 'regime' }, 'external'] },
        { in: [{ var: 'geometry' }, ['streamlined', 'rotating']] },
        { '!=': [{ var: 'application' }, 'jet'] },
        { '>=': [{ var: 'mach' }, 0.7] },
        { '<=': [{ var: 'mach' }, 0.95] },
        { '!=': [{ var: 'separation' }, 'none'] },
      ],
    },
    effects: {
      scores: { rans: -30, urans: 20, hybrid: 15 },
      cautions: [
        'Shock buffet: with shock-induced separation between about Mach 0.7 and 0.95 the shock can oscillate at a low frequency (a Strouhal number of order 0.06 on the chord). A steady solution may not converge or may hide it; run URANS or a hybrid method for several buffet periods and check the onset against a second model.',
      ],
    },
    why:
      'Transonic buffet is a self-sustained oscillation of the shock and the separated layer behind it. URANS captures its onset and frequency with shielded eddy-viscosity models, and zonal or delayed DES adds the resolved turbulence of the separated region.',
    source: 'Jacquin et al. 2009, AIAA J. 47, 1985; Deck 2005, AIAA J. 43, 1556; Iovnovich & Raveh 2012, AIAA J. 50, 880 (from memory)',
  },
  {
    id: 'supersonic-flow',
    title: 'Supersonic flow',
    stage: 'scoring',
    when: { in: [{ var: 'machRegime' }, ['supersonic', 'hypersonic']] },
    effects: {
      cautions: [
        'Supersonic: shocks need shock-capturing schemes and local refinement that these cell counts do not include; shock-boundary-layer interaction is a known weakness of RANS models, and the wall temperature changes the friction and heat flux strongly.',
      ],
    },
    why: 'Above Mach 1.2 shocks form ahead of and on the body, and their interaction with boundary layers is a hard case for every turbulence approach.',
    source: 'Anderson, Modern Compressible Flow; Knight & Degrez 1998, AGARD AR-319 (from memory)',
  },
  {
    id: 'hypersonic-flow',
    title: 'Hypersonic flow',
    stage: 'scoring',
    when: { '==': [{ var: 'machRegime' }, 'hypersonic'] },
    effects: {
      cautions: [
        'Hypersonic (Mach 5 and above): the gas heats far above the free stream in the boundary layer; vibrational excitation and dissociation may matter, the ideal-gas properties used here stop holding, and transition and wall heating dominate the design.',
      ],
    },
    why: 'From about Mach 5 the temperature rise across shocks and in boundary layers brings real-gas effects and makes wall temperature and transition the governing questions.',
    source: 'Anderson, Hypersonic and High-Temperature Gas Dynamics (from memory)',
  },
]

const WALL_RULES: RuleSource[] = [
  {
    id: 'rough-walls',
    title: 'Rough walls raise the friction',
    stage: 'scoring',
    when: { '!=': [{ var: 'roughnessRegime' }, 'smooth'] },
    effects: {
      cautions: [
        'Rough walls: the equivalent sand-grain height is an input to calibrate, not a measured height; a resolved wall needs a roughness boundary condition in the turbulence model (for example for omega), a rough-wall function needs the first cell centre above the roughness.',
      ],
    },
    why:
      'Above a roughness Reynolds number k_s+ of about 5 the roughness elements poke through the viscous sublayer and add form drag: the log law shifts down, the friction rises, and above about 70 it no longer depends on viscosity.',
    source: 'Nikuradse 1933 (via Schlichting, Boundary-Layer Theory); Colebrook 1939; Jiménez 2004, Annu. Rev. Fluid Mech. 36, 173 (from memory)',
  },
  {
    id: 'thick-layers-suit-wall-modelled-les',
    title: 'Thick boundary layers: wall-modelled LES is the affordable LES',
    stage: 'scoring',
    when: { '>=': [{ var: 'deltaPlus' }, 3000] },
    effects: { scores: { wmles: 5, wrles: -10 } },
    why:
      'The cost of wall-resolved LES grows almost like Re^1.9 because of the near-wall eddies, that of wall-modelled LES only like Re. ' +
      'Once the boundary layer is thousands of wall units thick, modelling the inner tenth of it is where LES of a practical flow becomes affordable.',
    source: 'Choi & Moin 2012, Phys. Fluids 24, 011702; Larsson et al. 2016, Mech. Eng. Rev. 3 (from memory)',
  },
  {
    id: 'short-log-layer-for-wall-model',
    title: 'Boundary layer too thin for a wall model',
    stage: 'scoring',
    when: { '<': [{ var: 'deltaPlus' }, 1000] },
    effects: { scores: { wmles: -20 } },
    why:
      'Wall-modelled LES uses cells of about a twentieth of the boundary-layer thickness and takes the wall model\'s input at a tenth of it, in the log layer at y+ of 30 or more. ' +
      'Both fit only when the thickness exceeds about a thousand wall units; below that a wall-resolved LES costs little more and models less.',
    source: 'Kawai & Larsson 2012, Phys. Fluids 24, 015105; Larsson et al. 2016, Mech. Eng. Rev. 3 (from memory)',
  },
]

const BUDGET_RULES: RuleSource[] = [
  {
    id: 'direct-simulation-within-reach',
    title: 'Resolving more of the turbulence when the budget has room',
    stage: 'scoring',
    when: { or: [{ '<': [{ var: 'budgetRatio.dns' }, 0.1] }, { '<': [{ var: 'budgetRatio.wrles' }, 0.1] }] },
    effects: { scores: { dns: headroomBonus('dns', 10, 10), wrles: headroomBonus('wrles', 5, 5) } },
    why:
      'When DNS or wall-resolved LES needs less than a tenth of the budget, resolving more of the turbulence removes modelling error at a price the project can pay: up to 10 points for DNS and 5 for wall-resolved LES, growing smoothly as the share falls.',
    source: 'Moin & Mahesh 1998, Annu. Rev. Fluid Mech. 30, 539; Pope, Turbulent Flows 2000',
  },
  {
    id: 'budget-trade-off',
    title: 'Cost against the budget, as a smooth trade-off',
    stage: 'scoring',
    when: { or: ALL.map((id) => ({ '>': [{ var: `budgetRatio.${id}` }, 1] })) },
    effects: { scores: Object.fromEntries(ALL.map((id) => [id, budgetTerm(id)])) },
    why:
      'An approach that exceeds the budget (the larger of core-hours and wall-clock over their budgets) loses 50 points per decade by which it exceeds it, down to -60; within the budget it loses nothing. ' +
      'A tenth more or less budget moves a score by about two points, never by a cliff; which approach the budget allows is then settled by the recommendation, not by a penalty.',
    source: 'common practice, no source',
  },
]

// Later rules' models replace earlier ones': the regime's come after the generic choices.
export const SCORING_RULES: RuleSource[] = [
  ...SEPARATION_RULES,
  ...QUANTITY_RULES,
  ...PHYSICS_RULES,
  ...APPLICATION_RULES,
  ...REGIME_RULES,
  ...COMPRESSIBILITY_RULES,
  ...WALL_RULES,
  ...BUDGET_RULES,
]
