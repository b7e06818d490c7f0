import { STATUS_CODES } from 'node:http'

// createError calls here carry a message for people but rarely a reason phrase; without one the
// status line and body read "Server Error" even for a 403 or a 404.
export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('error', (error) => {
    const e = error as { statusCode?: number; statusMessage?: string }
    if (e.statusCode && e.statusCode < 500 && !e.statusMessage) e.statusMessage = STATUS_CODES[e.statusCode]
  })
})
