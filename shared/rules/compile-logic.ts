/**
 * json-logic compiled to closures, once per expression, for the operations a rule may use
 * (ALLOWED_OPERATIONS). Replaying every past decision under a draft ruleset evaluates the same
 * few dozen expressions hundreds of thousands of times; interpreting the tree each time dominated
 * the engine's cost. The closures follow json-logic-js operation by operation (its source is the
 * reference, and a property test compares the two); any other operation is left to json-logic-js.
 * No code is generated from strings, so it also runs under a strict Content-Security-Policy.
 */
import jsonLogic, { type RulesLogic } from 'json-logic-js'

export type CompiledLogic = (data: unknown) => unknown

type Values = unknown[]

// json-logic-js's operations, with its coercions (loose equality, parseFloat in + and *).
const OPERATIONS: Record<string, (values: Values) => unknown> = {
  '==': v => v[0] == v[1],
  '===': v => v[0] === v[1],
  '!=': v => v[0] != v[1],
  '!==': v => v[0] !== v[1],
  '>': v => (v[0] as number) > (v[1] as number),
  '>=': v => (v[0] as number) >= (v[1] as number),
  '<': v => (v[2] === undefined ? (v[0] as number) < (v[1] as number) : (v[0] as number) < (v[1] as number) && (v[1] as number) < (v[2] as number)),
  '<=': v => (v[2] === undefined ? (v[0] as number) <= (v[1] as number) : (v[0] as number) <= (v[1] as number) && (v[1] as number) <= (v[2] as number)),
  '!!': v => jsonLogic.truthy(v[0]),
  '!': v => !jsonLogic.truthy(v[0]),
  '%': v => (v[0] as number) % (v[1] as number),
  'in': (v) => {
    const haystack = v[1] as { indexOf?: (item: unknown) => number } | null | undefined
    if (!haystack || typeof haystack.indexOf === 'undefined') return false
    return haystack.indexOf(v[0]) !== -1
  },
  'cat': v => v.join(''),
  '+': v => v.reduce((a: number, b) => parseFloat(a as unknown as string) + parseFloat(b as string), 0),
  '*': v => (v as number[]).reduce((a, b) => parseFloat(a as unknown as string) * parseFloat(b as unknown as string)),
  '-': v => (v[1] === undefined ? -(v[0] as number) : (v[0] as number) - (v[1] as number)),
  '/': v => (v[0] as number) / (v[1] as number),
  'min': v => Math.min(...(v as number[])),
  'max': v => Math.max(...(v as number[])),
}

function isLogic(logic: unknown): logic is Record<string, unknown> {
  return typeof logic === 'object' && logic !== null && !Array.isArray(logic) && Object.keys(logic).length === 1
}

/** A fact read by path, as json-logic's var: null (or the default) where the path leads nowhere. */
function readVar(data: unknown, name: unknown, fallback: unknown): unknown {
  const notFound = fallback === undefined ? null : fallback
  if (typeof name === 'undefined' || name === '' || name === null) return data
  let value = data
  for (const key of String(name).split('.')) {
    if (value === null || value === undefined) return notFound
    value = (value as Record<string, unknown>)[key]
    if (value === undefined) return notFound
  }
  return value
}

function compileVar(args: CompiledLogic[], raw: unknown[]): CompiledLogic {
  const [name, fallback] = raw
  // The usual case, a constant fact path: split it once.
  if (args.length <= 2 && typeof name === 'string' && name !== '' && (fallback === undefined || !isLogic(fallback) && !Array.isArray(fallback))) {
    const keys = name.split('.')
    const notFound = fallback === undefined ? null : fallback
    return (data) => {
      let value = data
      for (const key of keys) {
        if (value === null || value === undefined) return notFound
        value = (value as Record<string, unknown>)[key]
        if (value === undefined) return notFound
      }
      return value
    }
  }
  return (data) => {
    const values = args.map(arg => arg(data))
    return readVar(data, values[0], values[1])
  }
}

function compileBranching(op: string, args: CompiledLogic[]): CompiledLogic {
  if (op === 'if' || op === '?:') {
    return (data) => {
      let index = 0
      for (; index < args.length - 1; index += 2) {
        if (jsonLogic.truthy(args[index]!(data))) return args[index + 1]!(data)
      }
      return args.length === index + 1 ? args[index]!(data) : null
    }
  }
  const stopWhen = op === 'or'
  return (data) => {
    let current: unknown
    for (const arg of args) {
      current = arg(data)
      if (jsonLogic.truthy(current) === stopWhen) return current
    }
    return current
  }
}

/** A function giving what jsonLogic.apply(logic, data) gives, for any data. */
export function compileLogic(logic: unknown): CompiledLogic {
  if (Array.isArray(logic)) {
    const items = logic.map(compileLogic)
    return data => items.map(item => item(data))
  }
  if (!isLogic(logic)) return () => logic
  const op = Object.keys(logic)[0]!
  const raw = logic[op]
  const values = Array.isArray(raw) ? raw : [raw]
  if (op === 'if' || op === '?:' || op === 'and' || op === 'or') return compileBranching(op, values.map(compileLogic))
  const args = values.map(compileLogic)
  if (op === 'var') return compileVar(args, values)
  const operation = OPERATIONS[op]
  if (!operation) return data => jsonLogic.apply(logic as RulesLogic, data)
  if (args.length === 1) {
    const [a] = args as [CompiledLogic]
    return data => operation([a(data)])
  }
  if (args.length === 2) {
    const [a, b] = args as [CompiledLogic, CompiledLogic]
    return data => operation([a(data), b(data)])
  }
  return data => operation(args.map(arg => arg(data)))
}

const compiled = new WeakMap<object, CompiledLogic>()

/** The compiled form of a frozen expression, compiled on first request and kept while the expression lives. */
export function compiledLogic(logic: object): CompiledLogic {
  let run = compiled.get(logic)
  if (!run) {
    run = compileLogic(logic)
    compiled.set(logic, run)
  }
  return run
}

/**
 * jsonLogic.apply, compiled on first use for a frozen expression (a validated ruleset's are) and
 * reused; a mutable one is interpreted, since it could change after compiling.
 */
export function applyLogic(logic: unknown, data: unknown): unknown {
  if (typeof logic !== 'object' || logic === null || !Object.isFrozen(logic)) return jsonLogic.apply(logic as RulesLogic, data)
  return compiledLogic(logic)(data)
}
