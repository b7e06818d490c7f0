// The house's import rules, checked on the source: server never imports app; shared imports
// neither; server code has no import cycles (madge); server utils name what they use from other
// server utils in an import, so the dependency graph (and its cycles) is visible.
import { readdirSync, readFileSync } from 'node:fs'
import { join, relative } from 'node:path'
import madge from 'madge'
import { describe, expect, it } from 'vitest'

const ROOT = join(import.meta.dirname, '../../..')

function sourceFiles(dir: string): string[] {
  return readdirSync(join(ROOT, dir), { withFileTypes: true, recursive: true })
    .filter(entry => entry.isFile() && /\.(ts|vue)$/.test(entry.name))
    .map(entry => relative(ROOT, join(entry.parentPath, entry.name)))
}

/** Every module a file imports, as written. */
function importsOf(file: string): string[] {
  const text = readFileSync(join(ROOT, file), 'utf8')
  return [...text.matchAll(/^\s*(?:import|export)\s[^'"]*?from\s+['"]([^'"]+)['"]|^\s*import\s+['"]([^'"]+)['"]/gm)]
    .map(m => m[1] ?? m[2]!)
}

function crossings(dir: string, forbidden: RegExp) {
  return sourceFiles(dir).flatMap(file => importsOf(file)
    .filter(spec => forbidden.test(spec))
    .map(spec => `${file} imports ${spec}`))
}

describe('import rules', () => {
  it('server code never imports app code', () => {
    expect(crossings('server', /(^|\/)app\/|^~\/|^@\//)).toEqual([])
  })

  it('shared code imports neither app nor server code', () => {
    expect(crossings('shared', /(^|\/)(app|server)\/|^~\/|^~~\/|^@\//)).toEqual([])
  })

  it('server code has no import cycles', async () => {
    const graph = await madge(join(ROOT, 'server'), {
      fileExtensions: ['ts'],
      excludeRegExp: [/migrations/],
      detectiveOptions: { ts: { skipTypeImports: false } },
    })
    expect(Object.keys(graph.obj()).length).toBeGreaterThan(50)
    expect(graph.circular()).toEqual([])
  }, 60_000)

  it('server utils import what they use from other server utils (no hidden auto-imported dependency)', () => {
    const utils = sourceFiles('server/utils')
    // Framework-level refusals are used everywhere and depend on nothing of ours.
    const foundation = new Set(['server/utils/http/errors.ts', 'server/utils/http/validation.ts'])
    const exported = new Map<string, string>([['tables', 'server/utils/db.ts']])
    for (const file of utils) {
      for (const m of readFileSync(join(ROOT, file), 'utf8').matchAll(/^export (?:async )?(?:function|const|class|let)\s+(\w+)/gm)) {
        if (!exported.has(m[1]!)) exported.set(m[1]!, file)
      }
    }
    const hidden: string[] = []
    for (const file of utils) {
      const text = readFileSync(join(ROOT, file), 'utf8')
      const code = text.replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '').replace(/`(?:\\.|[^`])*`|'(?:\\.|[^'\n])*'/g, '\'\'')
      const imported = new Set([...text.matchAll(/import\s+(?:type\s+)?\{([^}]*)\}\s+from/g)]
        .flatMap(m => m[1]!.split(',').map(part => part.replace(/\btype\b/, '').split(/\sas\s/).at(-1)!.trim())))
      const declared = new Set([...code.matchAll(/^(?:export )?(?:async )?(?:function|const|let|class)\s+(\w+)/gm)].map(m => m[1]!))
      for (const [name, source] of exported) {
        if (source === file || foundation.has(source) || imported.has(name) || declared.has(name)) continue
        if (new RegExp(`(?<![\\w.])${name}\\b`).test(code)) hidden.push(`${file} uses ${name} from ${source}`)
      }
    }
    expect(hidden).toEqual([])
  })
})
