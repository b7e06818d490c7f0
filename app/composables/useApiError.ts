// Reads the message and per-field errors our API puts in a 4xx (see server/utils/validation.ts).
export type ApiErrorInfo = { status: number; message: string; fieldErrors: Record<string, string[]> }

export function apiErrorInfo(error: unknown): ApiErrorInfo {
  const e = error as { statusCode?: number; status?: number; data?: { message?: string; data?: { fieldErrors?: Record<string, string[]> } }; message?: string }
  const status = e?.statusCode ?? e?.status ?? 0
  const message = e?.data?.message ?? (status ? `Request failed (${status})` : 'The server could not be reached')
  return { status, message, fieldErrors: e?.data?.data?.fieldErrors ?? {} }
}

/** The first message per field, in the shape vee-validate's setErrors takes. */
export function firstFieldErrors(info: ApiErrorInfo): Record<string, string> {
  return Object.fromEntries(Object.entries(info.fieldErrors).map(([field, messages]) => [field, messages[0] ?? '']))
}
