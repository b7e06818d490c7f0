import type { TestProject } from 'vitest/node'
import { freePort, startServer } from '../support/test-server'

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string
    databaseUrl: string
  }
}

export default async function setup(project: TestProject) {
  const server = await startServer({ database: 'eddyledger_api', port: await freePort() })
  project.provide('baseUrl', server.url)
  project.provide('databaseUrl', server.databaseUrl)
  return () => server.stop()
}
