// The test mail catcher's inbox (maildev, started by scripts/test.sh), read over its REST API.
export type Message = { id: string; subject: string; text: string; to: { address: string }[] }

function maildev() {
  const url = process.env.TEST_MAILDEV_URL
  if (!url) throw new Error('TEST_MAILDEV_URL is not set: run the tests through npm test (scripts/test.sh)')
  return url
}

export async function inbox(): Promise<Message[]> {
  const res = await fetch(`${maildev()}/api/email`)
  if (!res.ok) throw new Error(`maildev answered ${res.status}`)
  return res.json() as Promise<Message[]>
}

export const sentTo = (m: Message, address: string) => m.to.some(t => t.address.toLowerCase() === address.toLowerCase())

/** Waits until the inbox holds at least `count` messages that match. */
export async function waitForMail(match: (m: Message) => boolean, { count = 1, timeout = 15_000 } = {}) {
  const deadline = Date.now() + timeout
  for (;;) {
    const found = (await inbox()).filter(match)
    if (found.length >= count) return found
    if (Date.now() > deadline) throw new Error(`expected ${count} matching message(s) in the inbox, found ${found.length}`)
    await new Promise(r => setTimeout(r, 250))
  }
}

/** Polls until `probe` gives a value. */
export async function until<T>(what: string, probe: () => Promise<T | undefined>, timeout = 15_000): Promise<T> {
  const deadline = Date.now() + timeout
  for (;;) {
    const value = await probe()
    if (value !== undefined) return value
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`)
    await new Promise(r => setTimeout(r, 250))
  }
}
