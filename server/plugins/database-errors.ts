// A PostgreSQL error the request caused (see server/utils/http/db-errors.ts) is answered as the 4xx
// it is, with a readable message, instead of a 500. The hook runs before the error is rendered.
export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('error', (error) => {
    const e = error as { statusCode?: number; statusMessage?: string; message: string; unhandled?: boolean; data?: unknown }
    if (e.statusCode !== undefined && e.statusCode < 500) return
    const answer = databaseErrorAnswer(error)
    if (!answer) return
    e.statusCode = answer.statusCode
    e.statusMessage = answer.statusCode === 409 ? 'Conflict' : 'Bad Request'
    e.message = answer.message
    e.data = undefined
    e.unhandled = false
  })
})
