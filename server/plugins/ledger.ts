// The ledger's timers: checkpoints by count and time (checked every pollSeconds), and the
// scheduled incremental verification that mails the auditors when it finds anything.
export default defineNitroPlugin((nitroApp) => {
  // Prerendering and build-time runs have no database.
  if (import.meta.prerender) return
  const c = useRuntimeConfig().ledger as Record<string, unknown>
  void prepareLedgerKey()
  const timers: ReturnType<typeof setInterval>[] = []
  const pollMs = Number(c.pollSeconds) * 1000
  if (pollMs > 0) timers.push(setInterval(() => void ledgerCheckpointTick(), pollMs))
  const verifyMs = Number(c.verifyMinutes) * 60_000
  if (verifyMs > 0) timers.push(setInterval(() => void scheduledLedgerVerification(verifyMs), verifyMs))
  for (const t of timers) t.unref()
  nitroApp.hooks.hook('close', () => timers.forEach(t => clearInterval(t)))
})
