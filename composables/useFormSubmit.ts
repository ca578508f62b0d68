// One submit cycle for the account forms: validate with the form's zod schema (field messages in
// `errors`), then run the request once with `busy` set, and show the server's message on failure.
import type { z } from 'zod'
import { fieldErrors } from '#shared/accounts/fields'

export function useFormSubmit<T extends Record<string, unknown>>(schema: z.ZodType, form: T, send: () => Promise<void>) {
  const errors = ref<Record<string, string>>({})
  const message = ref('')
  const busy = ref(false)

  async function submit() {
    message.value = ''
    errors.value = fieldErrors(schema, form)
    if (Object.keys(errors.value).length) return
    busy.value = true
    try {
      await send()
    }
    catch (error) {
      message.value = apiMessage(error)
    }
    finally {
      busy.value = false
    }
  }

  return { errors, message, busy, submit }
}
