// Upload limits, shown in the UI and enforced by the server.

/** Largest wall export stored, as uploaded (plain or gzip-compressed), bytes. */
export const MAX_UPLOAD_BYTES = 50 * 1024 * 1024
/** Largest decompressed size read from a gzip-compressed export, bytes (guards against a compression bomb). */
export const MAX_INFLATED_BYTES = 1024 * 1024 * 1024
/** File name endings accepted for a wall export. */
export const WALL_EXPORT_EXTENSIONS = ['.csv', '.tsv', '.txt', '.dat', '.csv.gz', '.tsv.gz', '.txt.gz', '.dat.gz'] as const

export function formatMegabytes(bytes: number) {
  return `${Math.round(bytes / (1024 * 1024))} MB`
}
