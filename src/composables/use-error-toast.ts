import { useToast } from 'primevue/usetoast'
import { onBeforeUnmount, onErrorCaptured, onMounted } from 'vue'
import { ApiError, isSessionProblem } from '@/api/client'

/**
 * API errors nobody handled on the spot (a failed load, a refused action) become a toast, so the
 * person always sees what went wrong. Forms that show field messages catch their own errors.
 * Called once in the root component: it hears errors thrown in components' handlers and
 * watchers, and promises rejected outside them.
 */
export function useErrorToast(): void {
  const toast = useToast()

  function show(error: ApiError): void {
    // The app already answers these by going to sign-in or to the set-password page.
    if (isSessionProblem(error)) return
    toast.add({ severity: 'error', summary: 'Request failed', detail: error.message, life: 6000 })
  }

  const onRejection = (event: PromiseRejectionEvent) => {
    if (!(event.reason instanceof ApiError)) return
    event.preventDefault()
    show(event.reason)
  }
  onErrorCaptured((error) => {
    if (!(error instanceof ApiError)) return
    show(error)
    return false
  })
  onMounted(() => window.addEventListener('unhandledrejection', onRejection))
  onBeforeUnmount(() => window.removeEventListener('unhandledrejection', onRejection))
}
