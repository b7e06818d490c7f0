// Generated wall exports with a known distribution against the 30-300 band of log-law wall
// functions. Every area is a multiple of 1/4 m², so the area sums, and the fractions, are exact
// in binary floating point.

export interface WallFileOptions {
  faces?: number
  area?: boolean
  delimiter?: string
  patchColumn?: boolean
}

/** Face i: i % 4 = 0 below the band (area 0.5), 1 inside (1), 2 inside (0.25), 3 above (0.25). */
export function wallRow(i: number) {
  const kind = i % 4
  const yPlus = kind === 0 ? 5 + (i % 20) : kind === 3 ? 400 + (i % 600) : 40 + (i % 250)
  const area = kind === 0 ? 0.5 : kind === 1 ? 1 : 0.25
  return { yPlus, area, patch: i % 2 === 0 ? 'hull' : 'rudder' }
}

export function wallCsv(options: WallFileOptions = {}) {
  const { faces = 1000, area = true, delimiter = ',', patchColumn = true } = options
  const header = ['face', ...(patchColumn ? ['patch'] : []), 'y+', ...(area ? ['face area [m^2]'] : [])]
  const lines = [header.join(delimiter)]
  for (let i = 0; i < faces; i++) {
    const row = wallRow(i)
    lines.push([i, ...(patchColumn ? [row.patch] : []), row.yPlus, ...(area ? [row.area] : [])].join(delimiter))
  }
  return `${lines.join('\n')}\n`
}

/**
 * Expected fractions over the first `faces` rows (faces a multiple of 4): by area 125 : 312.5 : 62.5
 * per 1000 faces, i.e. 0.25 below, 0.625 inside, 0.125 above; by face count 0.25, 0.5, 0.25.
 */
export const EXPECTED = {
  byArea: { below: 0.25, inside: 0.625, above: 0.125 },
  byCount: { below: 0.25, inside: 0.5, above: 0.25 },
}
