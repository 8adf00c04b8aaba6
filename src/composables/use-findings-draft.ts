import { computed, onBeforeUnmount, onMounted, ref, shallowRef, type Ref } from 'vue'
import { ApiError } from '@/api/client'
import { fetchFindings, saveFindings } from '@/api/findings'
import type { FindingsDocument } from '../../shared/findings/document'
import type { FindingsView } from '../../shared/schemas/findings'
import { dropLocalCopy, keepLocalCopy, readLocalCopy } from './findings-local-copy'
import { useAutosave } from './use-autosave'

export type SaveState = 'loading' | 'saved' | 'pending' | 'saving' | 'failed' | 'conflict'

/** The editor the draft talks to: where its text is read from and written into. */
export interface DraftEditor {
  doc: () => FindingsDocument | null
  replace: (doc: FindingsDocument) => void
}

const POLL_MS = 30_000
const sameDoc = (a: FindingsDocument, b: FindingsDocument) =>
  JSON.stringify(a) === JSON.stringify(b)

/**
 * The findings draft of one case: loads it, saves the editor's text a moment after each change
 * against the version it was written on, keeps the text in this browser until the server has
 * it, and on a conflict keeps both versions side by side so nothing is lost.
 */
export function useFindingsDraft(caseId: Ref<number>, editable: Ref<boolean>, editor: DraftEditor) {
  const view = shallowRef<FindingsView>()
  const version = ref(0)
  const state = ref<SaveState>('loading')
  const problem = ref<string>()
  /** the newer draft someone else saved, while the writer decides */
  const theirs = shallowRef<FindingsView>()
  /** the writer's own text, set aside after taking theirs, until they are done merging */
  const setAside = shallowRef<FindingsDocument>()

  function adopt(fresh: FindingsView): void {
    view.value = fresh
    version.value = fresh.version
  }

  async function load(): Promise<void> {
    const fresh = await fetchFindings(caseId.value)
    adopt(fresh)
    const aside = readLocalCopy(caseId.value, 'set-aside')
    // copies from an earlier visit become this tab's, so this tab may drop them when done
    if (aside) keepLocalCopy(caseId.value, aside.doc, aside.baseVersion, 'set-aside')
    setAside.value = aside?.doc
    const local = editable.value ? readLocalCopy(caseId.value) : null
    if (!local || sameDoc(local.doc, fresh.doc)) {
      // the server has this text already: nothing to keep
      if (local) dropLocalCopy(caseId.value, 'draft', true)
      editor.replace(fresh.doc)
      state.value = 'saved'
      return
    }
    keepLocalCopy(caseId.value, local.doc, local.baseVersion)
    editor.replace(local.doc)
    if (local.baseVersion === fresh.version) {
      state.value = 'pending'
      autosave.schedule()
    } else {
      theirs.value = fresh
      state.value = 'conflict'
    }
  }

  async function save(): Promise<void> {
    const doc = editor.doc()
    if (!doc || state.value === 'conflict' || !editable.value) return
    state.value = 'saving'
    try {
      const saved = await saveFindings(caseId.value, doc, version.value)
      adopt(saved)
      const now = editor.doc()
      if (now && sameDoc(now, doc)) {
        dropLocalCopy(caseId.value)
        state.value = 'saved'
      } else state.value = 'pending'
      problem.value = undefined
    } catch (error) {
      if (error instanceof ApiError && error.code === 'version_conflict') {
        theirs.value = (error.details as { current: FindingsView }).current
        state.value = 'conflict'
      } else {
        state.value = 'failed'
        problem.value = error instanceof Error ? error.message : String(error)
      }
    }
  }

  const autosave = useAutosave(save)

  /** Called on every change of the editor's text. */
  function changed(): void {
    const doc = editor.doc()
    if (!doc || !editable.value) return
    keepLocalCopy(caseId.value, doc, version.value)
    if (state.value === 'conflict') return
    state.value = 'pending'
    autosave.schedule()
  }

  /** Their draft goes into the editor; the writer's text stays beside it, to copy from. */
  function takeTheirs(): void {
    const current = theirs.value
    const mine = editor.doc()
    if (!current || !mine) return
    keepLocalCopy(caseId.value, mine, version.value, 'set-aside')
    setAside.value = mine
    dropLocalCopy(caseId.value)
    adopt(current)
    editor.replace(current.doc)
    theirs.value = undefined
    state.value = 'saved'
  }

  /** The writer chose, knowingly, to save their text over the newer draft. */
  async function keepMine(): Promise<void> {
    const current = theirs.value
    if (!current) return
    version.value = current.version
    theirs.value = undefined
    state.value = 'pending'
    await autosave.flush()
  }

  function doneMerging(): void {
    dropLocalCopy(caseId.value, 'set-aside')
    setAside.value = undefined
  }

  /** Live blocks and flags follow the case while the writer works; an idle copy follows others' saves. */
  async function poll(): Promise<void> {
    if (state.value !== 'saved') return
    const asked = version.value
    const fresh = await fetchFindings(caseId.value).catch(() => undefined)
    // anything saved or typed meanwhile is newer than this answer: leave it be
    if (!fresh || state.value !== 'saved' || version.value !== asked) return
    if (fresh.version < asked) return
    if (fresh.version > asked) editor.replace(fresh.doc)
    adopt(fresh)
  }

  const unsaved = computed(() => ['pending', 'saving', 'failed', 'conflict'].includes(state.value))
  const warnBeforeLeaving = (event: BeforeUnloadEvent) => {
    if (unsaved.value) event.preventDefault()
  }
  let timer: ReturnType<typeof setInterval> | undefined
  onMounted(() => {
    window.addEventListener('beforeunload', warnBeforeLeaving)
    timer = setInterval(() => void poll(), POLL_MS)
  })
  onBeforeUnmount(() => {
    window.removeEventListener('beforeunload', warnBeforeLeaving)
    clearInterval(timer)
    if (unsaved.value && state.value !== 'conflict') void autosave.flush()
  })

  return {
    view,
    version,
    state,
    problem,
    theirs,
    setAside,
    unsaved,
    load,
    changed,
    saveNow: autosave.flush,
    takeTheirs,
    keepMine,
    doneMerging,
    poll,
  }
}

export type FindingsDraft = ReturnType<typeof useFindingsDraft>
