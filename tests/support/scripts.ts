// Runs one of the project's scripts as a child process without blocking the test's event loop
// (a blocked loop breaks the HTTP client's kept-alive connections to the test server).
import { spawn } from 'node:child_process'

export function runScript(command: string, args: string[], env: NodeJS.ProcessEnv = process.env) {
  return new Promise<{ status: number | null; stdout: string; stderr: string }>((resolve, reject) => {
    const child = spawn(command, args, { env, stdio: ['ignore', 'pipe', 'pipe'] })
    let stdout = ''
    let stderr = ''
    child.stdout.on('data', (chunk) => { stdout += chunk })
    child.stderr.on('data', (chunk) => { stderr += chunk })
    child.once('error', reject)
    child.once('close', status => resolve({ status, stdout, stderr }))
  })
}
