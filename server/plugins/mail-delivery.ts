// Delivers the mail outbox every few seconds, so messages that failed (or were written by a process
// that stopped before sending) go out after a restart too. Each action also kicks a round at once.
const INTERVAL_MS = 10_000

export default defineNitroPlugin((nitroApp) => {
  // Prerendering and build-time runs have no database to deliver from.
  if (import.meta.prerender) return
  const timer = setInterval(() => {
    if (!mailDeliveryRunning()) kickMailDelivery()
  }, INTERVAL_MS)
  timer.unref()
  nitroApp.hooks.hook('close', () => clearInterval(timer))
})
