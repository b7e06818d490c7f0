import type { H3Event } from 'h3'

// The routes that take a file upload (multipart/form-data) instead of a JSON body, with the body
// size each allows. Every other write route accepts JSON only. A new upload route is added here.
export const UPLOAD_ROUTES: readonly { what: string; path: RegExp; maxBytes: () => number }[] = [
  {
    // A wall-check result file; the route itself refuses files over 50 MB.
    what: 'wall-check upload',
    path: /^\/api\/.+\/wall-checks$/,
    maxBytes: () => Number(useRuntimeConfig().bodyLimit.uploadBytes),
  },
]

export function requestPath(event: H3Event) {
  return event.path.split('?')[0]!
}

/** The upload route the request is for, if any (POST and PUT only). */
export function uploadRouteOf(event: H3Event) {
  if (event.method !== 'POST' && event.method !== 'PUT') return undefined
  const path = requestPath(event)
  return UPLOAD_ROUTES.find(route => route.path.test(path))
}
