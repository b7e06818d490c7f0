import type { H3Event } from 'h3'

// HSTS only means something over TLS (browsers ignore it on plain HTTP), and a local
// http://127.0.0.1 set-up must not be told to switch to HTTPS, so it is sent only when the request
// came in over TLS, directly or through a trusted proxy (X-Forwarded-Proto).
const HSTS = 'max-age=31536000; includeSubDomains'

export function setTransportSecurity(event: H3Event) {
  const trustProxy = useRuntimeConfig().loginLimit.trustProxy === true
  if (getRequestProtocol(event, { xForwardedProto: trustProxy }) === 'https') {
    setResponseHeader(event, 'Strict-Transport-Security', HSTS)
  }
}
