/**
 * A case and its advice as labelled rows, in the units the case was typed in: the decision page,
 * each revision, the revision diff, the PDF record and the mail all read the same rows. Each row
 * carries the value's text for people and a unit-free key for comparing two revisions (so a case
 * re-typed in other units is not a change).
 */
import { APPROACH_LABELS, WALL_TREATMENT_LABELS, type Advice, type CaseInput } from '../rules'
import { ASSUMED, type EnteredCase, type QuantityValue } from '../schemas/case-form'
import type { RequestedChoice } from '../types/decisions'
import { defaultUnit, fromSI, tidy, toSI, unitLabel, UNIT_SYSTEM_LABELS, type QuantityKind, type UnitSystem } from '../units'
import { GEOMETRY_LABELS, MEDIUM_LABELS, PHYSICS_LABELS, QUANTITY_LABELS, REGIME_LABELS, SEPARATION_LABELS } from '../utils/case-labels'
import { formatDuration, formatEstimate, formatInput, formatNumber, formatQuantity, UNIT_SPACE } from '../utils/format'

export type RowGroup = 'case' | 'fluid' | 'scales' | 'physics' | 'budget' | 'mesh' | 'advice' | 'choice'

export interface Row {
  key: string
  label: string
  text: string
  /** what two revisions compare on: SI values and choice ids, never display text */
  compare: string
  group: RowGroup
  /** the engine's assumption for a field left empty */
  assumed?: boolean
}

export const ROW_GROUP_LABELS: Record<RowGroup, string> = {
  case: 'Flow',
  fluid: 'Fluid',
  scales: 'Scales',
  physics: 'Physics and quantities of interest',
  budget: 'Compute budget',
  mesh: 'Near-wall mesh settings',
  advice: 'Advice',
  choice: "Engineer's own choice",
}

function typed(kind: QuantityKind, q: QuantityValue | undefined): { text: string; compare: string } | null {
  if (!q || q.value === undefined || q.value === null || Number.isNaN(q.value)) return null
  return {
    text: `${formatInput(q.value)}${UNIT_SPACE}${unitLabel(kind, q.unit)}`,
    compare: String(tidy(toSI(kind, q.value, q.unit), 9)),
  }
}

function assumedQuantity(kind: QuantityKind, siValue: number, system: UnitSystem, why: string) {
  const unit = defaultUnit(kind, system)
  return {
    text: `${formatInput(tidy(fromSI(kind, siValue, unit), 6))}${UNIT_SPACE}${unitLabel(kind, unit)} (${why})`,
    compare: String(tidy(siValue, 9)),
  }
}

/** The inputs of a case as typed, with what the engine assumed for fields left empty. */
export function caseRows(entered: EnteredCase, caseInput: CaseInput, system: UnitSystem): Row[] {
  const internal = entered.regime === 'internal'
  const rows: Row[] = []
  const add = (group: RowGroup, key: string, label: string, text: string, compare: string, assumed = false) =>
    rows.push({ group, key, label, text, compare, ...(assumed ? { assumed } : {}) })

  add('case', 'regime', 'Flow regime', REGIME_LABELS[entered.regime], entered.regime)
  add('case', 'geometry', 'Geometry', GEOMETRY_LABELS[entered.geometry], entered.geometry)
  add('case', 'separation', 'Expected separation', SEPARATION_LABELS[entered.separation], entered.separation)

  const medium = entered.fluid.medium
  add('fluid', 'medium', 'Fluid', MEDIUM_LABELS[medium], medium)
  if (medium === 'custom') {
    const density = typed('density', entered.fluid.density)
    const viscosity = typed('viscosity', entered.fluid.viscosity)
    add('fluid', 'density', 'Density', density?.text ?? '—', density?.compare ?? '')
    add('fluid', 'viscosity', 'Dynamic viscosity', viscosity?.text ?? '—', viscosity?.compare ?? '')
  } else {
    const temperature = typed('temperature', entered.fluid.temperature)
    add('fluid', 'temperature', 'Temperature', temperature?.text ?? '—', temperature?.compare ?? '')
    if (medium === 'air') {
      const pressure = typed('pressure', entered.fluid.pressure)
      const shown = pressure ?? assumedQuantity('pressure', caseInput.fluid.pressurePa ?? ASSUMED.pressurePa, system, 'one standard atmosphere, assumed')
      add('fluid', 'pressure', 'Static pressure', shown.text, shown.compare, !pressure)
    }
  }

  const velocity = typed('velocity', entered.velocity)
  add('scales', 'velocity', internal ? 'Bulk velocity' : 'Free-stream velocity', velocity?.text ?? '—', velocity?.compare ?? '')
  const length = typed('length', entered.length)
  add('scales', 'length', internal ? 'Hydraulic diameter' : 'Reference length', length?.text ?? '—', length?.compare ?? '')
  if (internal) {
    const roughness = typed('roughness', entered.roughness)
    add('scales', 'roughness', 'Wall roughness (sand-grain)', roughness?.text ?? 'smooth wall', roughness?.compare ?? '0')
  }
  const intensity = entered.turbulenceIntensityPercent
  const intensityPercent = intensity ?? caseInput.turbulenceIntensity * 100
  add('scales', 'turbulenceIntensity', 'Turbulence intensity',
    `${formatInput(intensityPercent)}${UNIT_SPACE}%${intensity === undefined ? ' (assumed)' : ''}`,
    String(tidy(intensityPercent / 100, 9)), intensity === undefined)

  const ticked = Object.entries(entered.physics).filter(([, on]) => on).map(([k]) => k as keyof typeof PHYSICS_LABELS)
  add('physics', 'physics', 'Physics present', ticked.length ? ticked.map(k => PHYSICS_LABELS[k]).join('; ') : 'none ticked', ticked.sort().join(','))
  add('physics', 'quantities', 'Quantities of interest', entered.quantities.map(q => QUANTITY_LABELS[q]).join('; '), [...entered.quantities].sort().join(','))

  const { budget } = entered
  add('budget', 'coreHours', 'Core-hour budget', `${formatInput(budget.coreHours)}${UNIT_SPACE}core-h`, String(budget.coreHours))
  add('budget', 'cores', 'Cores', formatInput(budget.cores), String(budget.cores))
  add('budget', 'wallClockHours', 'Wall-clock budget', `${formatInput(budget.wallClockHours)}${UNIT_SPACE}h`, String(budget.wallClockHours))

  add('mesh', 'yPlusTarget', 'Target y+', entered.yPlusTarget === undefined ? "not set (each treatment's own)" : formatInput(entered.yPlusTarget), String(entered.yPlusTarget ?? ''))
  const growth = entered.growthRatio ?? caseInput.growthRatio
  add('mesh', 'growthRatio', 'Growth ratio', `${formatInput(growth)}${entered.growthRatio === undefined ? ' (assumed)' : ''}`, String(growth), entered.growthRatio === undefined)
  return rows
}

/** A distance in the unit system's unit for small lengths (mm or in). */
export function formatDistance(meters: number, system: UnitSystem, figures = 3): string {
  const unit = defaultUnit('roughness', system)
  return formatQuantity(fromSI('roughness', meters, unit), unitLabel('roughness', unit), figures)
}

/** The engineer's own choice as input rows ("the engine's" where none was made). */
export function requestedRows(requested: RequestedChoice | null): Row[] {
  const row = (key: string, label: string, text: string, compare: string): Row => ({ group: 'choice', key, label, text, compare })
  return [
    row('requested.approach', 'Requested approach', requested?.approach ? APPROACH_LABELS[requested.approach] : "the engine's", requested?.approach ?? ''),
    row('requested.wallTreatment', 'Requested wall treatment', requested?.wallTreatment ? WALL_TREATMENT_LABELS[requested.wallTreatment] : "the engine's", requested?.wallTreatment ?? ''),
    ...(requested ? [row('requested.reason', 'Reason for the choice', requested.reason, requested.reason)] : []),
  ]
}

/** What the advice concluded, as rows a reviewer compares between revisions. */
export function adviceRows(advice: Advice, system: UnitSystem): Row[] {
  const rec = advice.recommendation
  const chosen = advice.approaches.find(a => a.id === rec.approach)
  const fired = advice.trace.filter(t => t.fired).map(t => t.title)
  const row = (key: string, label: string, text: string, compare = text): Row => ({ group: 'advice', key, label, text, compare })
  return [
    row('approach', 'Recommended approach', APPROACH_LABELS[rec.approach], rec.approach),
    row('model', 'Model', rec.model),
    row('wallTreatment', 'Wall treatment', WALL_TREATMENT_LABELS[rec.wallTreatment], rec.wallTreatment),
    row('reynolds', 'Reynolds number', formatNumber(advice.reynolds)),
    row('adviceYPlus', 'Target y+ of the first cell', formatNumber(rec.yPlusTarget)),
    row('firstCellHeight', 'First-cell height', formatDistance(advice.wall.firstCellHeight, system), formatNumber(advice.wall.firstCellHeight)),
    row('layers', 'Layers to the boundary-layer edge', String(advice.wall.layers)),
    row('coreHoursEstimate', 'Core-hours of the recommendation', formatEstimate(chosen?.coreHours)),
    row('wallClockEstimate', 'Wall-clock of the recommendation', formatDuration(chosen?.wallClockHours)),
    row('fits', 'Fits the budget', chosen?.feasible ? 'yes' : 'no'),
    row('rules', 'Rules that fired', fired.length ? fired.join('; ') : 'none', [...fired].sort().join('|')),
    row('cautions', 'Cautions', `${advice.cautions.length}`),
  ]
}

export interface RowChange {
  key: string
  label: string
  group: RowGroup
  before: string | null
  after: string | null
}

/** The rows whose values differ between two revisions (in each one's own units), in the later one's order. */
export function diffRows(before: Row[], after: Row[]): RowChange[] {
  const earlier = new Map(before.map(r => [r.key, r]))
  const later = new Map(after.map(r => [r.key, r]))
  const changes: RowChange[] = []
  for (const row of after) {
    const old = earlier.get(row.key)
    if (!old || old.compare !== row.compare) {
      changes.push({ key: row.key, label: row.label, group: row.group, before: old?.text ?? null, after: row.text })
    }
  }
  for (const row of before) {
    if (!later.has(row.key)) changes.push({ key: row.key, label: row.label, group: row.group, before: row.text, after: null })
  }
  return changes
}

/** A revision as the diff reads it. */
export interface RevisionForDiff {
  unitSystem: UnitSystem
  entered: EnteredCase
  caseInput: CaseInput
  advice: Advice
  requested: RequestedChoice | null
}

/** What changed from one revision to another: the inputs (unit system included) and the advice. */
export function revisionDiff(before: RevisionForDiff, after: RevisionForDiff) {
  const unitRow = (r: RevisionForDiff): Row => ({ group: 'case', key: 'unitSystem', label: 'Unit system', text: UNIT_SYSTEM_LABELS[r.unitSystem], compare: r.unitSystem })
  return {
    inputs: diffRows(
      [unitRow(before), ...caseRows(before.entered, before.caseInput, before.unitSystem), ...requestedRows(before.requested)],
      [unitRow(after), ...caseRows(after.entered, after.caseInput, after.unitSystem), ...requestedRows(after.requested)],
    ),
    advice: diffRows(adviceRows(before.advice, before.unitSystem), adviceRows(after.advice, after.unitSystem)),
  }
}
