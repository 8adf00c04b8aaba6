import { onBeforeUnmount } from 'vue'

export interface AutosaveOptions {
  /** quiet time after the last change before saving */
  delayMs?: number
  /** longest a change waits while the writer keeps typing */
  maxWaitMs?: number
}

/**
 * Debounced saving with one save in flight at a time: changes made while a save runs are saved
 * right after it, against the version that save answered.
 */
export function useAutosave(save: () => Promise<void>, options: AutosaveOptions = {}) {
  const delayMs = options.delayMs ?? 1500
  const maxWaitMs = options.maxWaitMs ?? 10_000
  let timer: ReturnType<typeof setTimeout> | undefined
  let waitingSince: number | undefined
  let running: Promise<void> | undefined
  let again = false

  function cancel(): void {
    clearTimeout(timer)
    timer = undefined
    waitingSince = undefined
  }

  function flush(): Promise<void> {
    cancel()
    if (running) {
      again = true
      return running
    }
    running = save().finally(() => {
      running = undefined
      if (again) {
        again = false
        void flush()
      }
    })
    return running
  }

  function schedule(): void {
    const now = Date.now()
    waitingSince ??= now
    clearTimeout(timer)
    const wait = Math.min(delayMs, Math.max(0, waitingSince + maxWaitMs - now))
    timer = setTimeout(() => void flush(), wait)
  }

  onBeforeUnmount(cancel)
  return { schedule, flush, cancel }
}
