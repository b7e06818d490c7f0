// Multipart uploads through the real server with a signed-in client's cookie.
import type { ApiClient, ApiResponse } from './api-client'

export async function uploadFile(client: ApiClient, path: string, file: { bytes: Uint8Array; name: string; type?: string }, fields: Record<string, string> = {}): Promise<ApiResponse> {
  const form = new FormData()
  for (const [key, value] of Object.entries(fields)) form.append(key, value)
  form.append('file', new Blob([file.bytes], { type: file.type ?? 'text/csv' }), file.name)
  return send(client, path, { body: form })
}

/** The same multipart body sent as a stream of unknown length (chunked, no Content-Length). */
export async function uploadStreamed(client: ApiClient, path: string, parts: { name: string; size: number; chunk: Uint8Array }): Promise<ApiResponse> {
  const boundary = `----eddyledger${Date.now()}`
  const head = new TextEncoder().encode(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${parts.name}"\r\nContent-Type: text/csv\r\n\r\n`)
  const tail = new TextEncoder().encode(`\r\n--${boundary}--\r\n`)
  let sent = 0
  let stage = 0
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (stage === 0) { controller.enqueue(head); stage = 1; return }
      if (stage === 1 && sent < parts.size) {
        const n = Math.min(parts.chunk.length, parts.size - sent)
        controller.enqueue(parts.chunk.subarray(0, n))
        sent += n
        return
      }
      if (stage === 1) { controller.enqueue(tail); stage = 2; return }
      controller.close()
    },
  })
  return send(client, path, { body, headers: { 'content-type': `multipart/form-data; boundary=${boundary}` }, duplex: 'half' })
}

async function send(client: ApiClient, path: string, init: { body: BodyInit; headers?: Record<string, string>; duplex?: 'half' }): Promise<ApiResponse> {
  const res = await fetch(client.baseUrl + path, {
    method: 'POST',
    headers: { accept: 'application/json', 'x-forwarded-for': client.address, ...(client.cookie ? { cookie: client.cookie } : {}), ...init.headers },
    body: init.body,
    ...(init.duplex ? { duplex: init.duplex } : {}),
  } as RequestInit)
  const text = await res.text()
  let parsed: unknown = text
  try { parsed = text ? JSON.parse(text) : null } catch { /* not JSON */ }
  return { status: res.status, body: parsed as any, headers: res.headers }
}
