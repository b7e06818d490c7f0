// The record's content as rows: the case as typed (in its units), the near-wall mesh, the costs
// compared, an event's details.
import { APPROACH_LABELS, WALL_TREATMENT_LABELS, type ApproachId, type WallTreatment } from '#shared/rules'
import { caseRows as typedCaseRows, formatDistance } from '#shared/format/case-rows'
import type { ChoiceCost } from '#shared/types/decisions'
import { defaultUnit, fromSI, unitLabel, type UnitSystem } from '#shared/units'
import { formatDuration, formatEstimate, formatNumber, formatQuantity } from '#shared/utils/format'
import type { DecisionReportData } from './data'

export const utc = (date: Date | string) => new Date(date).toISOString().replace('T', ' ').replace(/\.\d{3}Z$/, ' UTC')
export const approachLabel = (id: string) => APPROACH_LABELS[id as ApproachId] ?? id
export const treatmentLabel = (id: string) => WALL_TREATMENT_LABELS[id as WallTreatment] ?? id

/** One line for the footer of every page: the general cautions in brief. */

/** One line for the footer of every page: the general cautions in brief, short enough for a footer. */
export const FOOTER_CAUTION = "Order-of-magnitude estimates for planning; verify y+ on the real solution. Your organisation's procedures, local codes and licensed engineering practice take precedence."

/** The case as the engineer typed it, in its units (the rows the decision page shows), then the figures the engine derived. */
export function caseRows(data: DecisionReportData): [string, string][] {
  const { caseInput, advice, entered, unitSystem } = data.decision
  const density = defaultUnit('density', unitSystem)
  const viscosity = defaultUnit('viscosity', unitSystem)
  const derived: [string, string][] = [
    ['Density used', formatQuantity(fromSI('density', advice.fluid.density, density), unitLabel('density', density))],
    ['Dynamic viscosity used', formatQuantity(fromSI('viscosity', advice.fluid.viscosity, viscosity), unitLabel('viscosity', viscosity))],
    ['Reynolds number', `${formatNumber(advice.reynolds)} (dimensionless)`],
    ['Large-eddy Reynolds number', `${formatNumber(advice.reynoldsTurbulent)} (intensity × Re)`],
    ...(advice.mach !== null ? [['Mach number', `${formatNumber(advice.mach)} (dimensionless)`] as [string, string]] : []),
  ]
  return [
    ...typedCaseRows(entered, caseInput, unitSystem).map((row): [string, string] => [row.label, row.text]),
    ...derived,
  ]
}

/** The near-wall figures in the decision's unit system (mm or in, Pa or lbf/ft², m/s or ft/s). */
export function wallRows(wall: DecisionReportData['decision']['advice']['wall'], system: UnitSystem): [string, string][] {
  const stress = defaultUnit('stress', system)
  const speed = defaultUnit('velocity', system)
  return [
    ['Wall treatment', treatmentLabel(wall.wallTreatment)],
    ['Target y+ (first cell centre)', `${formatNumber(wall.yPlusTarget)} (dimensionless)`],
    ['First-cell-centre distance', formatDistance(wall.firstCellCentre, system)],
    ['First-cell height (2 × centre)', formatDistance(wall.firstCellHeight, system)],
    ['Wall shear stress', formatQuantity(fromSI('stress', wall.wallShearStress, stress), unitLabel('stress', stress))],
    ['Friction velocity', formatQuantity(fromSI('velocity', wall.frictionVelocity, speed), unitLabel('velocity', speed))],
    ['Boundary-layer thickness', formatDistance(wall.boundaryLayerThickness, system)],
    ['Layers to the boundary-layer edge', `${formatNumber(wall.layers)} layers`],
    ['Growth ratio', `${formatNumber(wall.growthRatio)} (dimensionless)`],
    ['Skin-friction coefficient', `${formatNumber(wall.skinFriction)} (dimensionless)`],
  ]
}

/** The cost lines of the engine's recommendation beside another choice's (an override, the engineer's own). */
export function costComparisonRows(advice: DecisionReportData['decision']['advice'], cost: ChoiceCost | undefined): string[][] {
  const engine = advice.approaches.find(a => a.id === advice.recommendation.approach)
  if (!cost || !engine) return []
  return [
    ['Cells', formatEstimate(engine.cells), formatEstimate(cost.cells)],
    ['Steps', formatEstimate(engine.timeSteps), formatEstimate(cost.timeSteps)],
    ['Core-hours', formatEstimate(engine.coreHours), formatEstimate(cost.coreHours)],
    ['Wall-clock', formatDuration(engine.wallClockHours), formatDuration(cost.wallClockHours)],
    ['Fits the budget', engine.feasible ? 'yes' : 'no', cost.feasible ? 'yes' : 'no'],
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
