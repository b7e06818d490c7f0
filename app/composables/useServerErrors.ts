// A form's submit against our API: a refusal's per-field messages land on the fields (vee-validate's
// setErrors) and its summary in `serverError`.
export function useServerErrors(setErrors: (errors: Record<string, string>) => void) {
  const serverError = ref('')
  async function attempt(action: () => Promise<unknown>) {
    serverError.value = ''
    try {
      await action()
    } catch (error) {
      const info = apiErrorInfo(error)
      setErrors(firstFieldErrors(info))
      serverError.value = info.message
    }
  }
  return { serverError, attempt }
}
