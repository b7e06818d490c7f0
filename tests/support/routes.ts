// Every API route file, as { method, path } with its parameters filled in, so the access tests
// cover routes added later without being edited.
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'

const API_DIR = new URL('../../server/api', import.meta.url).pathname
const METHODS = ['get', 'post', 'put', 'patch', 'delete'] as const

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name)
    return statSync(full).isDirectory() ? walk(full) : [full]
  })
}

export function apiRoutes() {
  return walk(API_DIR).filter(f => f.endsWith('.ts')).map((file) => {
    const rel = relative(API_DIR, file).replace(/\.ts$/, '')
    const parts = rel.split('.')
    const method = (METHODS as readonly string[]).includes(parts.at(-1)!) ? parts.pop()!.toUpperCase() : 'GET'
    // The path with its parameters as written ("/api/decisions/[id]/approve"), and filled with 1.
    const template = ('/api/' + parts.join('.').replace(/(^|\/)index$/, '')).replace(/\/$/, '')
    return { method, path: template.replace(/\[[^\]]+\]/g, '1'), template, file: rel }
  })
}
