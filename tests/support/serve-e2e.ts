// Playwright's web server: the built app on a fresh database, until Playwright stops it.
import { startServer } from './test-server'

const port = Number(process.argv[2] || 3999)
const server = await startServer({ database: 'eddyledger_e2e', port })
console.log(`e2e server at ${server.url}`)
const stop = async () => { await server.stop(); process.exit(0) }
process.on('SIGTERM', stop)
process.on('SIGINT', stop)
