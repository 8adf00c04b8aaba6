import { ref, watch } from 'vue'
import type { z } from 'zod/mini'
import { ApiError } from '@/api/client'

type FieldMessages = Record<string, string>

function topField(path: string): string {
  return path.split('.')[0] ?? path
}

function firstMessagePerField(entries: [string, string][]): FieldMessages {
  const messages: FieldMessages = {}
  for (const [path, message] of entries) messages[topField(path)] ??= message
  return messages
}

/**
 * Messages beside form fields, from the same zod schema the server validates with and from the
 * server's own field messages; anything else the server refuses becomes one message for the form.
 */
export function useFormErrors() {
  const fieldErrors = ref<FieldMessages>({})
  const formError = ref('')
  const sending = ref(false)

  function clear(): void {
    fieldErrors.value = {}
    formError.value = ''
  }

  /** Parses the form's value; on failure shows each issue beside its field and answers undefined. */
  function validate<Schema extends z.ZodMiniType>(
    schema: Schema,
    value: unknown,
  ): z.output<Schema> | undefined {
    clear()
    const result = schema.safeParse(value)
    if (result.success) return result.data
    fieldErrors.value = firstMessagePerField(
      result.error.issues.map((issue) => [issue.path.map(String).join('.'), issue.message]),
    )
    return undefined
  }

  /**
   * Shows a refusal from the server on the form. A session problem is shown too: the app's own
   * handler moves on to sign-in or set-password anyway, and a failed sign-in is one of them.
   */
  function showServerError(error: unknown): void {
    if (!(error instanceof ApiError)) throw error
    fieldErrors.value = firstMessagePerField(Object.entries(error.fieldMessages()))
    formError.value = error.message
  }

  /**
   * Sends a checked form: `sending` is true meanwhile, and a refusal lands on the form. Answers
   * whether it went through.
   */
  async function send(action: () => Promise<unknown>): Promise<boolean> {
    sending.value = true
    try {
      await action()
      return true
    } catch (error) {
      showServerError(error)
      return false
    } finally {
      sending.value = false
    }
  }

  /** Takes a field's message away as soon as the person edits that field. */
  function clearWhenEdited(form: Record<string, unknown>): void {
    watch(
      () => ({ ...form }),
      (now, before) => {
        const edited = Object.keys(now).filter((key) => now[key] !== before[key])
        if (edited.length === 0 || Object.keys(fieldErrors.value).length === 0) return
        fieldErrors.value = Object.fromEntries(
          Object.entries(fieldErrors.value).filter(([field]) => !edited.includes(field)),
        )
      },
    )
  }

  return { fieldErrors, formError, sending, clear, validate, send, clearWhenEdited }
}
