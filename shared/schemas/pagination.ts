// Keyset (cursor) pages for long lists: `?cursor=&limit=` answers { items, nextCursor, total,
// totalIsEstimate }. A cursor is the sort key of the last row shown (a time and a decision id), so
// a page deep in the list costs what the first one does. Pure: used by the pages and the routes.
import { z } from 'zod'

/** Where a page starts: after the row with this time and id, in the list's order. */
export type PageCursor = { at: Date; id: number }

export type Page<Item> = {
  items: Item[]
  /** Give this back as `cursor` for the next page; null on the last page. */
  nextCursor: string | null
  /** Rows the filter selects; from the planner's estimate when counting them all would cost. */
  total: number
  totalIsEstimate: boolean
}

function toBase64Url(text: string) {
  return btoa(text).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '')
}

function fromBase64Url(text: string) {
  return atob(text.replace(/-/g, '+').replace(/_/g, '/'))
}

export function encodeCursor(cursor: PageCursor): string {
  return toBase64Url(`${cursor.at.toISOString()}|${cursor.id}`)
}

/** The cursor a server gave, or null when the text is not one. */
export function decodeCursor(text: string): PageCursor | null {
  try {
    const [iso, id] = fromBase64Url(text).split('|')
    const at = new Date(iso ?? '')
    const number = Number(id)
    if (Number.isNaN(at.getTime()) || !Number.isInteger(number) || number < 0 || at.toISOString() !== iso) return null
    return { at, id: number }
  } catch {
    return null
  }
}

const blankIsUnset = (value: unknown) => (value === '' ? undefined : value)

export const cursorSchema = z.preprocess(blankIsUnset, z.string({ invalid_type_error: 'The cursor must be text.' })
  .max(100, 'The cursor is not one this server gave; start again from the first page.')
  .transform((text, ctx) => {
    const cursor = decodeCursor(text)
    if (!cursor) ctx.addIssue({ code: z.ZodIssueCode.custom, message: 'The cursor is not one this server gave; start again from the first page.' })
    return cursor ?? z.NEVER
  })
  .optional())

/** `cursor` and `limit` (rows per page, 1 to `max`). */
export function pageQuerySchema(max: number, byDefault: number) {
  return z.object({
    cursor: cursorSchema,
    limit: z.coerce.number({ invalid_type_error: 'The limit must be a number.' }).int('The limit must be a whole number.')
      .min(1, 'The limit is at least 1.').max(max, `The limit is at most ${max}.`).default(byDefault),
  })
}
