// Maps a 400 from the server (data.issues: [{ field, message }]) onto fields.
export function useFormErrors() {
  const fields = ref<Record<string, string>>({})
  const general = ref('')

  function reset() {
    fields.value = {}
    general.value = ''
  }

  function take(err: unknown) {
    reset()
    const e = err as { data?: { message?: string, data?: { issues?: { field: string, message: string }[] } }, statusMessage?: string, message?: string }
    const issues = e?.data?.data?.issues
    if (issues?.length) {
      for (const i of issues) fields.value[i.field] = i.message
    }
    else {
      general.value = e?.data?.message || e?.statusMessage || e?.message || 'The request failed.'
    }
  }

  return { fields, general, reset, take }
}
