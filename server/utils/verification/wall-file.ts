import { createReadStream } from 'node:fs'
import { Transform, type Readable } from 'node:stream'
import { createGunzip } from 'node:zlib'
import Papa from 'papaparse'
import {
  BAD_ROW_SAMPLES, MAX_BAD_ROW_SHARE, MAX_INFLATED_BYTES, WALL_EXPORT_EXTENSIONS, WallTally, formatMegabytes,
  guessColumns, looksLikeData, numberedColumns, parseArea, parseYPlus,
  type BadRow, type WallCheckColumns, type WallCheckResult, type YPlusBand,
} from '#shared/verification'
import type { ReceivedFile } from '../storage/multipart-upload'

// Reading a solver's wall export: type checks on the bytes (not the name or the claimed type),
// the delimiter and header sniffed with papaparse on the first lines, the columns mapped, then
// every row parsed as a stream into the running statistics. Bad rows are counted by line.

const GZIP_MAGIC = [0x1f, 0x8b]
const ZIP_MAGIC = [0x50, 0x4b, 0x03, 0x04]
const TEXT_TYPES = new Set([
  'text/csv', 'text/plain', 'text/tab-separated-values', 'application/csv', 'application/vnd.ms-excel',
  'application/gzip', 'application/x-gzip', 'application/octet-stream', '',
])
const SNIFF_LINES = 50

export type WallMappingRequest = { yPlusColumn?: string; areaColumn?: string; patchColumn?: string }

function startsWith(head: Buffer, magic: number[]) {
  return magic.every((byte, i) => head[i] === byte)
}

function unsupported(message: string): never {
  throw createError({ statusCode: 415, message })
}

/** Type checks of an upload: its name, its claimed type and, above all, its first bytes. */
export function checkWallFileType(file: ReceivedFile): { compressed: boolean; contentType: string } {
  const name = file.fileName.toLowerCase()
  if (!WALL_EXPORT_EXTENSIONS.some(ext => name.endsWith(ext))) {
    unsupported(`"${file.fileName}" is not a wall export Eddyledger reads: use a CSV or TSV table (${WALL_EXPORT_EXTENSIONS.join(', ')})`)
  }
  if (!TEXT_TYPES.has(file.claimedType.split(';')[0]!.trim())) {
    unsupported(`The file was sent as ${file.claimedType}; a wall export is a CSV or TSV text table, plain or gzip-compressed`)
  }
  if (file.size === 0) throw createError({ statusCode: 400, message: 'The file is empty' })
  if (startsWith(file.head, ZIP_MAGIC)) unsupported('This is a zip archive (or a spreadsheet workbook); export the table as CSV, or compress it with gzip')
  const compressed = startsWith(file.head, GZIP_MAGIC)
  if (name.endsWith('.gz') && !compressed) unsupported(`"${file.fileName}" is named .gz but is not gzip-compressed`)
  return { compressed, contentType: compressed ? 'application/gzip' : 'text/csv' }
}

/** The file's text as a stream: decompressed when gzip, capped in size. */
function textStream(file: ReceivedFile, compressed: boolean): Readable {
  const source: Readable = createReadStream(file.path)
  let inflated = 0
  const cap = new Transform({
    transform(chunk: Buffer, _enc, done) {
      inflated += chunk.length
      if (inflated > MAX_INFLATED_BYTES) {
        done(createError({ statusCode: 413, message: `The decompressed table is larger than ${formatMegabytes(MAX_INFLATED_BYTES)}; export the wall patches only` }))
        return
      }
      done(null, chunk)
    },
  })
  const chain = compressed ? source.pipe(createGunzip()) : source
  chain.on('error', (error: Error) => cap.destroy(
    (error as { statusCode?: number }).statusCode ? error : createError({ statusCode: 400, message: `The gzip data is damaged: ${error.message}` }),
  ))
  return chain.pipe(cap)
}

/** The first lines of the text, for sniffing; refuses binary content. */
async function firstLines(file: ReceivedFile, compressed: boolean): Promise<string> {
  const stream = textStream(file, compressed)
  const chunks: Buffer[] = []
  let length = 0
  try {
    for await (const chunk of stream) {
      chunks.push(chunk as Buffer)
      length += (chunk as Buffer).length
      if (length >= 64 * 1024) break
    }
  } finally {
    stream.destroy()
  }
  const bytes = Buffer.concat(chunks).subarray(0, 64 * 1024)
  if (bytes.includes(0)) unsupported('The file holds binary data, not a text table; export it as CSV or TSV')
  let text: string
  try {
    // A multi-byte character may be cut at the end of the sample: decode in streaming mode.
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes, { stream: true })
  } catch {
    unsupported('The file is not UTF-8 (or ASCII) text; export the table as UTF-8 CSV')
  }
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/)
  return lines.slice(0, Math.min(SNIFF_LINES, Math.max(1, lines.length - 1))).join('\n')
}

function isComment(row: readonly string[]) {
  return row.length > 0 && (row[0] ?? '').trimStart().startsWith('#')
}

function isEmpty(row: readonly string[]) {
  return row.every(cell => cell.trim() === '')
}

function uniqueNames(names: string[]) {
  const seen = new Map<string, number>()
  return names.map((raw) => {
    const name = raw.trim() || 'unnamed'
    const n = (seen.get(name) ?? 0) + 1
    seen.set(name, n)
    return n === 1 ? name : `${name} (${n})`
  })
}

/** Delimiter, header and columns from the first lines; 400 with the columns when the y+ column is unclear. */
export async function sniffWallFile(file: ReceivedFile, compressed: boolean, request: WallMappingRequest) {
  const sample = await firstLines(file, compressed)
  const sniffed = Papa.parse<string[]>(sample, { delimitersToGuess: [',', '\t', ';', '|'], skipEmptyLines: 'greedy' })
  const rows = sniffed.data.filter(row => !isComment(row))
  if (!rows.length) throw createError({ statusCode: 400, message: 'The file has no rows to read' })
  const delimiter = sniffed.meta.delimiter || ','
  const header = !looksLikeData(rows[0]!)
  const width = Math.max(...rows.map(r => r.length))
  const columns = header ? uniqueNames(rows[0]!) : numberedColumns(width)
  const guess = guessColumns(columns)

  const pick = (role: string, given: string | undefined, guessed: string | undefined) => {
    if (!given) return guessed
    if (columns.includes(given)) return given
    throw createError({
      statusCode: 400,
      message: `The file has no column "${given}" for ${role}; its columns are: ${columns.join(', ')}`,
      data: { columns, fieldErrors: { [`${role}Column`]: [`No column named "${given}"`] } },
    })
  }
  const yPlus = pick('yPlus', request.yPlusColumn, guess.mapping.yPlus)
  const area = request.areaColumn === '' ? undefined : pick('area', request.areaColumn, guess.ambiguous.includes('area') ? undefined : guess.mapping.area)
  const patch = request.patchColumn === '' ? undefined : pick('patch', request.patchColumn, guess.ambiguous.includes('patch') ? undefined : guess.mapping.patch)
  if (!yPlus) {
    throw createError({
      statusCode: 400,
      message: `Which column holds y+? The file's columns are: ${columns.join(', ')}. Choose it and upload again.`,
      data: { columns, header, delimiter, ambiguous: guess.ambiguous, fieldErrors: { yPlusColumn: ['Choose the y+ column'] } },
    })
  }
  if (request.areaColumn === undefined && guess.ambiguous.includes('area')) {
    throw createError({
      statusCode: 400,
      message: `More than one column could be the face area (${columns.filter(c => /area/i.test(c)).join(', ') || 'several'}); choose one, or none, and upload again.`,
      data: { columns, header, delimiter, ambiguous: guess.ambiguous, fieldErrors: { areaColumn: ['Choose the face-area column'] } },
    })
  }
  const mapping: WallCheckColumns = { yPlus, area: area ?? null, patch: patch ?? null, header, delimiter }
  return { mapping, columns, ambiguous: guess.ambiguous.filter(role => role !== 'yPlus') }
}

/** Every row of the file into the statistics against the band; bad rows counted by line number. */
export async function parseWallFile(file: ReceivedFile, compressed: boolean, mapping: WallCheckColumns, columns: string[], band: YPlusBand): Promise<WallCheckResult> {
  const iy = columns.indexOf(mapping.yPlus)
  const ia = mapping.area ? columns.indexOf(mapping.area) : -1
  const ip = mapping.patch ? columns.indexOf(mapping.patch) : -1
  const needed = Math.max(iy, ia, ip) + 1
  const tally = new WallTally(band, ia >= 0)
  const badRowSamples: BadRow[] = []
  let badRows = 0
  let line = 0
  let headerSkipped = !mapping.header

  const parser = Papa.parse(Papa.NODE_STREAM_INPUT, { delimiter: mapping.delimiter, skipEmptyLines: false })
  const text = textStream(file, compressed)
  text.setEncoding('utf8')
  text.on('error', (error) => parser.destroy(error))
  text.pipe(parser)
  const bad = (reason: string) => {
    badRows++
    if (badRowSamples.length < BAD_ROW_SAMPLES) badRowSamples.push({ line, reason })
  }
  for await (const raw of parser as AsyncIterable<string[]>) {
    // One record per line: wall exports carry no quoted line breaks.
    line++
    const row = line === 1 && raw.length ? [raw[0]!.replace(/^\uFEFF/, ''), ...raw.slice(1)] : raw
    if (isEmpty(row) || isComment(row)) continue
    if (!headerSkipped) {
      headerSkipped = true
      continue
    }
    if (row.length < needed) {
      bad(`${row.length} field${row.length === 1 ? '' : 's'}, expected at least ${needed}`)
      continue
    }
    const yPlus = parseYPlus(row[iy])
    if (typeof yPlus === 'string') {
      bad(yPlus)
      continue
    }
    let area = 1
    if (ia >= 0) {
      const parsed = parseArea(row[ia])
      if (typeof parsed === 'string') {
        bad(parsed)
        continue
      }
      area = parsed
    }
    tally.add(yPlus, area, ip >= 0 ? (row[ip] ?? '').trim() : '')
  }

  const stats = tally.result()
  const where = badRowSamples.slice(0, 10).map(b => `line ${b.line}: ${b.reason}`).join('; ')
  if (stats.rows === 0) {
    throw createError({ statusCode: 400, message: `No row of the file could be read${where ? ` (${where})` : ''}`, data: { badRows, badRowSamples } })
  }
  if (badRows > MAX_BAD_ROW_SHARE * (badRows + stats.rows)) {
    throw createError({
      statusCode: 400,
      message: `${badRows} of ${badRows + stats.rows} rows could not be read, too many to judge the wall (${where}${badRows > 10 ? '; …' : ''})`,
      data: { badRows, badRowSamples },
    })
  }
  const cautions: string[] = []
  if (!stats.areaWeighted) {
    cautions.push('The file gives no face areas, so every face counts the same: on a mesh with graded surface cells the fractions below are shares of faces, not of wall area. Export the face area to weight by area.')
  }
  if (badRows) cautions.push(`${badRows} row${badRows === 1 ? '' : 's'} could not be read and ${badRows === 1 ? 'is' : 'are'} left out; see the lines listed.`)
  return { ...stats, badRows, badRowSamples, cautions }
}
