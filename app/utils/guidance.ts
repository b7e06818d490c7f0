/** Guidance articles from content/guidance/*.md (our own words), bundled at build time. */
const FILES = import.meta.glob('../../content/guidance/*.md', { query: '?raw', import: 'default', eager: true }) as Record<string, string>

export type GuidanceKind = 'approach' | 'wall-treatment'
export interface GuidanceArticle {
  slug: string
  title: string
  kind: GuidanceKind
  summary: string
  body: string
}

// The order an engineer reads them in: most resolved to most modelled, then the walls.
const ORDER = [
  'dns', 'wrles', 'wmles', 'hybrid', 'urans', 'rans', 'laminar',
  'resolved', 'blended', 'wall-function', 'rough-wall-function', 'wall-model',
]

function parse(path: string, raw: string): GuidanceArticle {
  const slug = path.split('/').pop()!.replace(/\.md$/, '')
  const match = /^---\n([\s\S]*?)\n---\n?/.exec(raw)
  const meta: Record<string, string> = {}
  for (const line of (match?.[1] ?? '').split('\n')) {
    const at = line.indexOf(':')
    if (at > 0) meta[line.slice(0, at).trim()] = line.slice(at + 1).trim()
  }
  return {
    slug,
    title: meta.title ?? slug,
    kind: meta.kind === 'wall-treatment' ? 'wall-treatment' : 'approach',
    summary: meta.summary ?? '',
    body: match ? raw.slice(match[0].length) : raw,
  }
}

export const GUIDANCE: readonly GuidanceArticle[] = Object.entries(FILES)
  .map(([path, raw]) => parse(path, raw))
  .sort((a, b) => ORDER.indexOf(a.slug) - ORDER.indexOf(b.slug))

export function guidanceArticle(slug: string): GuidanceArticle | undefined {
  return GUIDANCE.find((a) => a.slug === slug)
}
