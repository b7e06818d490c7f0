/**
 * The cost model calibrated from a team's own runs: the measured cost per cell-step of each
 * approach on each kind of hardware, how far the engine's estimates have been off, and the
 * estimate of an advice recomputed with an adopted calibration. CPU core-hours and GPU hours are
 * never mixed. Relative imports only.
 */
import { APPROACH_IDS, type ApproachId } from '../rules/approaches'

export const HARDWARE = ['cpu', 'gpu'] as const
export type Hardware = (typeof HARDWARE)[number]
export const HARDWARE_LABELS: Record<Hardware, string> = { cpu: 'CPU', gpu: 'GPU' }
/** Unit of a run's compute: core-hours on CPUs, device-hours on GPUs. */
export const HOURS_UNIT: Record<Hardware, string> = { cpu: 'core-h', gpu: 'GPU-h' }

/** A calibration is adopted only from this many runs of an approach on one kind of hardware (our rule). */
export const MIN_RUNS_TO_ADOPT = 3

export interface RunFigures {
  approach: ApproachId
  hardware: Hardware
  cells: number
  /** physical time steps (iterations for steady RANS) */
  timeSteps: number
  /** core-hours (CPU) or GPU-hours (GPU) */
  coreHours: number
  /** the engine's estimate for the same approach when the decision was signed off */
  estimated?: { cells: number; timeSteps: number; coreHours: number } | null
}

/** Measured cost per cell per step: coreHours x 3600 / (cells x timeSteps), core-seconds (or GPU-seconds). */
export function costPerCellStep(run: { cells: number; timeSteps: number; coreHours: number }): number {
  return (run.coreHours * 3600) / (run.cells * run.timeSteps)
}

function geometricMean(values: readonly number[]): number {
  return Math.exp(values.reduce((sum, v) => sum + Math.log(v), 0) / values.length)
}

/** Geometric standard deviation (a factor, 1 when all agree; sample form, n - 1). */
function geometricSpread(values: readonly number[]): number {
  if (values.length < 2) return 1
  const mean = values.reduce((sum, v) => sum + Math.log(v), 0) / values.length
  const variance = values.reduce((sum, v) => sum + (Math.log(v) - mean) ** 2, 0) / (values.length - 1)
  return Math.exp(Math.sqrt(variance))
}

export interface CalibrationEntry {
  approach: ApproachId
  hardware: Hardware
  runs: number
  /** geometric mean of the runs' cost per cell-step, core-seconds (CPU) or GPU-seconds (GPU) */
  coreSecondsPerCellStep: number
  /** geometric standard deviation of the runs' cost per cell-step (a factor of 1 or more) */
  spread: number
  min: number
  max: number
  /** the engine's cost per cell-step in the runs' estimates (CPU only) */
  publishedCoreSecondsPerCellStep: number | null
  /** measured over published cost per cell-step (CPU only) */
  costFactor: number | null
  /** geometric mean of actual over estimated core-hours: how far the whole estimate was off (CPU only) */
  estimateFactor: number | null
  /** the same for the cell count and the number of steps, to see where the estimate went wrong */
  cellsFactor: number | null
  stepsFactor: number | null
  adoptable: boolean
}

/** Groups runs by approach and hardware and measures each group. */
export function calibrate(runs: readonly RunFigures[]): CalibrationEntry[] {
  const groups = new Map<string, RunFigures[]>()
  for (const run of runs) {
    if (!(run.cells > 0 && run.timeSteps > 0 && run.coreHours > 0)) continue
    const key = `${run.approach}|${run.hardware}`
    groups.set(key, [...(groups.get(key) ?? []), run])
  }
  const entries: CalibrationEntry[] = []
  for (const group of groups.values()) {
    const { approach, hardware } = group[0]!
    const measured = group.map(costPerCellStep)
    const withEstimates = hardware === 'cpu' ? group.filter(r => r.estimated && r.estimated.coreHours > 0 && r.estimated.cells > 0 && r.estimated.timeSteps > 0) : []
    const ratio = (pick: (r: RunFigures) => [number, number]) =>
      withEstimates.length ? geometricMean(withEstimates.map((r) => { const [a, e] = pick(r); return a / e })) : null
    const published = withEstimates.length ? geometricMean(withEstimates.map(r => costPerCellStep(r.estimated!))) : null
    const k = geometricMean(measured)
    entries.push({
      approach,
      hardware,
      runs: group.length,
      coreSecondsPerCellStep: k,
      spread: geometricSpread(measured),
      min: Math.min(...measured),
      max: Math.max(...measured),
      publishedCoreSecondsPerCellStep: published,
      costFactor: published ? k / published : null,
      estimateFactor: ratio(r => [r.coreHours, r.estimated!.coreHours]),
      cellsFactor: ratio(r => [r.cells, r.estimated!.cells]),
      stepsFactor: ratio(r => [r.timeSteps, r.estimated!.timeSteps]),
      adoptable: group.length >= MIN_RUNS_TO_ADOPT,
    })
  }
  return entries.sort((a, b) => APPROACH_IDS.indexOf(a.approach) - APPROACH_IDS.indexOf(b.approach) || a.hardware.localeCompare(b.hardware))
}

// ---- an adopted calibration applied to an advice

export interface AdoptedEntry {
  approach: ApproachId
  hardware: Hardware
  runs: number
  coreSecondsPerCellStep: number
  spread: number
}

export interface AdoptedCalibration {
  version: number
  adoptedAt: string
  adoptedBy: string
  entries: AdoptedEntry[]
}

export interface CalibratedApproach {
  approach: ApproachId
  /** the engine's estimate with its published cost per cell-step, core-hours */
  publishedCoreHours: number
  /** the same cells and steps at the team's measured CPU cost per cell-step, core-hours */
  teamCoreHours: number | null
  /** the same at the team's GPU cost per cell-step, GPU-hours */
  teamGpuHours: number | null
  used: 'published' | 'team'
  runs: number
  gpuRuns: number
  /** team over published */
  factor: number | null
  spread: number | null
}

export interface CalibrationBlock {
  /** for the recommended approach: which estimate the figures below lead with */
  used: 'published' | 'team'
  runs: number
  factor: number | null
  version: number | null
  adoptedAt: string | null
  approach: ApproachId
  coreHours: number
  approaches: CalibratedApproach[]
}

type AdviceCost = { recommendation: { approach: ApproachId }; approaches: { id: ApproachId; cells: number; timeSteps: number; coreHours: number }[] }

/**
 * Both estimates for every approach of an advice: the engine's, and the same cell count and steps
 * at the team's adopted cost per cell-step where one exists. The engine is untouched.
 */
export function calibratedEstimates(advice: AdviceCost, adopted: AdoptedCalibration | null, focus: ApproachId = advice.recommendation.approach): CalibrationBlock {
  const find = (id: ApproachId, hardware: Hardware) => adopted?.entries.find(e => e.approach === id && e.hardware === hardware)
  const approaches = advice.approaches.map((a): CalibratedApproach => {
    const cpu = find(a.id, 'cpu')
    const gpu = find(a.id, 'gpu')
    const cellSteps = a.cells * a.timeSteps
    const team = cpu ? (cellSteps * cpu.coreSecondsPerCellStep) / 3600 : null
    return {
      approach: a.id,
      publishedCoreHours: a.coreHours,
      teamCoreHours: team,
      teamGpuHours: gpu ? (cellSteps * gpu.coreSecondsPerCellStep) / 3600 : null,
      used: cpu ? 'team' : 'published',
      runs: cpu?.runs ?? 0,
      gpuRuns: gpu?.runs ?? 0,
      factor: team !== null && a.coreHours > 0 ? team / a.coreHours : null,
      spread: cpu?.spread ?? null,
    }
  })
  const main = approaches.find(a => a.approach === focus) ?? approaches[0]!
  return {
    used: main.used,
    runs: main.runs,
    factor: main.factor,
    version: adopted?.version ?? null,
    adoptedAt: adopted?.adoptedAt ?? null,
    approach: main.approach,
    coreHours: main.teamCoreHours ?? main.publishedCoreHours,
    approaches,
  }
}
