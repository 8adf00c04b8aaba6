import { useToast } from 'primevue/usetoast'
import { onBeforeUnmount, onMounted } from 'vue'
import { ApiError } from '@/api/client'

/**
 * API errors nobody handled on the spot (a failed load, a refused action) become a toast, so the
 * person always sees what went wrong. Forms that show field messages catch their own errors.
 */
export function useErrorToast(): void {
  const toast = useToast()
  const onRejection = (event: PromiseRejectionEvent) => {
    if (!(event.reason instanceof ApiError)) return
    event.preventDefault()
    toast.add({
      severity: 'error',
      summary: 'Request failed',
      detail: event.reason.message,
      life: 6000,
    })
  }
  onMounted(() => window.addEventListener('unhandledrejection', onRejection))
  onBeforeUnmount(() => window.removeEventListener('unhandledrejection', onRejection))
}
