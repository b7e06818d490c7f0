// Prints the public keys that verify this ledger's checkpoints (the active one and the retired
// ones kept outside the database), as PEM with their names: for backups and for the auditors.
import { keySettingsFromEnv, loadSigningKey, loadTrustedKeys, publicPemOf } from '../server/db/ledger-keys'

const settings = keySettingsFromEnv()
const own = loadSigningKey(settings)
for (const [keyId, key] of loadTrustedKeys(settings, own)) {
  console.log(`# ${keyId}${own?.keyId === keyId ? ' (active)' : ' (retired)'}\n${publicPemOf(key)}\n`)
}
