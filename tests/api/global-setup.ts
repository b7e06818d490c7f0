import type { TestProject } from 'vitest/node'
import { freePort, startServer } from '../support/test-server'

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string
    /** The owner's connection (the same as databaseOwnerUrl), for reaching the database directly. */
    databaseUrl: string
    databaseOwnerUrl: string
    /** The server's own connection (the app role). */
    databaseAppUrl: string
  }
}

export default async function setup(project: TestProject) {
  const server = await startServer({ database: 'eddyledger_api', port: await freePort() })
  project.provide('baseUrl', server.url)
  project.provide('databaseUrl', server.databaseUrl)
  project.provide('databaseOwnerUrl', server.databaseOwnerUrl)
  project.provide('databaseAppUrl', server.databaseAppUrl)
  return () => server.stop()
}
