// Small statistics for the benchmarks.
export function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b)
  const middle = Math.floor(sorted.length / 2)
  return sorted.length % 2 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2
}

export const ms = (value: number) => `${value.toFixed(1).padStart(7)} ms`
export const ratio = (value: number) => `${value.toFixed(2)}x`
