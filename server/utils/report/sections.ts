// The record's content as rows: the case as entered, the near-wall mesh, an event's details.
import { APPROACH_LABELS, WALL_TREATMENT_LABELS, type ApproachId, type WallTreatment } from '#shared/rules'
import { GEOMETRY_LABELS, MEDIUM_LABELS, PHYSICS_LABELS, QUANTITY_LABELS, REGIME_LABELS, SEPARATION_LABELS } from '#shared/utils/case-labels'
import { formatPercent, formatQuantity, formatSig } from '#shared/utils/format'
import type { DecisionReportData } from './data'

export const utc = (date: Date | string) => new Date(date).toISOString().replace('T', ' ').replace(/\.\d{3}Z$/, ' UTC')
export const approachLabel = (id: string) => APPROACH_LABELS[id as ApproachId] ?? id
export const treatmentLabel = (id: string) => WALL_TREATMENT_LABELS[id as WallTreatment] ?? id

/** One line for the footer of every page: the general cautions in brief. */
export const FOOTER_CAUTION = "Order-of-magnitude estimates for planning; verify y+ on the real solution. Your organisation's procedures, local codes and licensed engineering practice take precedence."

export const INPUT_FIGURES = 6

export function caseRows(data: DecisionReportData): [string, string][] {
  const input = data.decision.caseInput
  const { advice } = data.decision
  const internal = input.regime === 'internal'
  const ticked = Object.entries(input.physics ?? {}).filter(([, on]) => on).map(([k]) => PHYSICS_LABELS[k as keyof typeof PHYSICS_LABELS] ?? k)
  // The engineer's own inputs are recorded as entered (up to INPUT_FIGURES figures), not rounded.
  const given = (value: number | undefined, unit: string, otherwise: string) => (value === undefined ? otherwise : formatQuantity(value, unit, INPUT_FIGURES))
  return [
    ['Flow regime', REGIME_LABELS[input.regime]],
    ['Geometry', GEOMETRY_LABELS[input.geometry]],
    ['Separation expected', SEPARATION_LABELS[input.separation]],
    ['Fluid', MEDIUM_LABELS[input.fluid.medium]],
    ['Temperature', given(input.fluid.temperatureK, 'K', 'not given (the engine default for the fluid)')],
    ...(input.fluid.medium === 'air' ? [['Static pressure', given(input.fluid.pressurePa, 'Pa', 'not given (one standard atmosphere)')] as [string, string]] : []),
    ['Density used', formatQuantity(advice.fluid.density, 'kg/m³')],
    ['Dynamic viscosity used', formatQuantity(advice.fluid.viscosity, 'Pa·s')],
    ['Kinematic viscosity', formatQuantity(advice.fluid.kinematicViscosity, 'm²/s')],
    [internal ? 'Bulk velocity' : 'Free-stream velocity', formatQuantity(input.velocity, 'm/s', INPUT_FIGURES)],
    [internal ? 'Hydraulic diameter' : 'Reference length', formatQuantity(input.length, 'm', INPUT_FIGURES)],
    ...(internal ? [['Wall roughness (sand-grain)', given(input.roughness, 'm', 'smooth wall')] as [string, string]] : []),
    ['Turbulence intensity', `${formatSig(input.turbulenceIntensity, INPUT_FIGURES)} (${formatPercent(input.turbulenceIntensity, INPUT_FIGURES)})`],
    ['Physics', ticked.length ? ticked.join('; ') : 'none ticked'],
    ['Quantities of interest', input.quantities.map((q) => QUANTITY_LABELS[q] ?? q).join('; ')],
    ['Core-hour budget', formatQuantity(input.budget.coreHours, 'core-h', INPUT_FIGURES)],
    ['Cores', `${formatSig(input.budget.cores, INPUT_FIGURES)} cores`],
    ['Wall-clock budget', formatQuantity(input.budget.wallClockHours, 'h', INPUT_FIGURES)],
    ['Target y+', input.yPlusTarget === undefined ? "not set (the wall treatment's own)" : `${formatSig(input.yPlusTarget, INPUT_FIGURES)} (dimensionless)`],
    ['Growth ratio', `${formatSig(input.growthRatio, INPUT_FIGURES)} (dimensionless)`],
    ['Reynolds number', `${formatSig(advice.reynolds)} (dimensionless)`],
    ...(advice.mach !== null ? [['Mach number', `${formatSig(advice.mach)} (dimensionless)`] as [string, string]] : []),
  ]
}

export function wallRows(wall: DecisionReportData['decision']['advice']['wall']): [string, string][] {
  return [
    ['Wall treatment', treatmentLabel(wall.wallTreatment)],
    ['Target y+ (first cell centre)', `${formatSig(wall.yPlusTarget)} (dimensionless)`],
    ['First-cell-centre distance', formatQuantity(wall.firstCellCentre, 'm')],
    ['First-cell height (2 × centre)', formatQuantity(wall.firstCellHeight, 'm')],
    ['Wall shear stress', formatQuantity(wall.wallShearStress, 'Pa')],
    ['Friction velocity', formatQuantity(wall.frictionVelocity, 'm/s')],
    ['Boundary-layer thickness', formatQuantity(wall.boundaryLayerThickness, 'm')],
    ['Layers to the boundary-layer edge', `${formatSig(wall.layers)} layers`],
    ['Growth ratio', `${formatSig(wall.growthRatio)} (dimensionless)`],
    ['Skin-friction coefficient', `${formatSig(wall.skinFriction)} (dimensionless)`],
  ]
}

export function eventDetails(payload: unknown): { note?: string } {
  const p = (payload && typeof payload === 'object' ? payload : {}) as Record<string, unknown>
  const parts: string[] = []
  if (typeof p.revision === 'number') parts.push(`revision ${p.revision}`)
  if (typeof p.runId === 'number' && typeof p.approach === 'string') parts.push(`ran ${approachLabel(p.approach)}, ${formatSig(Number(p.coreHours))} ${p.hardware === 'gpu' ? 'GPU-h' : 'core-h'}`)
  else if (typeof p.approach === 'string') parts.push(`chose ${approachLabel(p.approach)}`)
  if (typeof p.fractionInBand === 'number') parts.push(`${formatPercent(p.fractionInBand, 3)} of the wall in band, ${String(p.verdict)}`)
  if (typeof p.accepted === 'boolean') parts.push(p.accepted ? 'accepted' : 'rejected')
  if (typeof p.gciFine === 'number') parts.push(`fine-grid GCI ${formatPercent(p.gciFine, 3)}`)
  if (typeof p.sha256 === 'string') parts.push(`sha256 ${p.sha256.slice(0, 16)}…`)
  if (typeof p.reason === 'string') parts.push(`retracted: "${p.reason}"`)
  if (typeof p.model === 'string') parts.push(`model ${p.model}`)
  if (typeof p.wallTreatment === 'string') parts.push(treatmentLabel(p.wallTreatment))
  if (Array.isArray(p.disagreedRules) && p.disagreedRules.length) parts.push(`disagreed with rule ${p.disagreedRules.join(', ')}`)
  if (typeof p.supersedes === 'number') parts.push(`supersedes decision ${p.supersedes}`)
  if (typeof p.supersededBy === 'number') parts.push(`superseded by decision ${p.supersededBy}`)
  const comment = typeof p.comment === 'string' && p.comment.trim() ? `"${p.comment.trim()}"` : ''
  const note = [parts.join('; '), comment].filter(Boolean).join(' — ')
  return note ? { note } : {}
}
