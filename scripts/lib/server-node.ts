// How the built server is started everywhere (npm start, the API and browser tests, the benchmarks):
// node with the heap options in package.json's config.serverNodeArgs, so all of them run the server
// the way it is deployed. Why the options: where the heap limit is large (over 2 GB, V8's default on
// a machine with a lot of memory) V8 lets the old generation grow to four times the live heap before
// a full collection. A long export then shows as 100 MB and more of resident memory that is only
// garbage. A 1 GB limit makes V8 collect at about 1.6 times the live heap (some 40 MB here), and
// smaller young-generation semispaces keep the rest down. Relative imports only: plain Node runs this.
import { readFileSync } from 'node:fs'

export function serverNodeArgs(): string[] {
  const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { config?: { serverNodeArgs?: string } }
  return (pkg.config?.serverNodeArgs ?? '').split(/\s+/).filter(Boolean)
}
