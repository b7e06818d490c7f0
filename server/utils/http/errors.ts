// Refusals every concern throws the same way; h3 turns them into the status and a readable message.

/** 404 for something that does not exist (or that the route may not reveal). */
export function notFound(message: string) {
  return createError({ statusCode: 404, message })
}

/** 409 when the thing is in a state that does not allow the action. */
export function conflict(message: string) {
  return createError({ statusCode: 409, message })
}

/** 400 for a request the route cannot take, with per-field messages for the form (as zodValidator gives). */
export function badRequest(message: string, fieldErrors: Record<string, string[]> = {}) {
  return createError({ statusCode: 400, message, data: { fieldErrors } })
}
