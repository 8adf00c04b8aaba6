import type { FindingsDocument } from '../../shared/findings/document'

/**
 * The writer's text, kept in this browser until the server has it: a closed tab, a lost
 * connection or someone else's save never costs them what they typed.
 */
export interface LocalFindingsCopy {
  doc: FindingsDocument
  /** the server version the text was written on */
  baseVersion: number
  keptAt: string
  /** the tab that kept it: a tab drops only its own copy, never another tab's unsaved text */
  tab: string
}

/** This tab's mark on the copies it keeps. */
export const THIS_TAB = `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`

/** `draft`: the text being written; `set-aside`: the writer's own text beside a newer saved draft */
export type CopySlot = 'draft' | 'set-aside'

const keyOf = (caseId: number, slot: CopySlot) => `fractolog:findings:${caseId}:${slot}`

export function readLocalCopy(caseId: number, slot: CopySlot = 'draft'): LocalFindingsCopy | null {
  try {
    const raw = localStorage.getItem(keyOf(caseId, slot))
    if (!raw) return null
    const copy = JSON.parse(raw) as LocalFindingsCopy
    return copy?.doc?.type === 'doc' && Number.isInteger(copy.baseVersion) ? copy : null
  } catch {
    return null
  }
}

/** Answers false when the browser refuses (storage full or disabled): the page then says so. */
export function keepLocalCopy(
  caseId: number,
  doc: FindingsDocument,
  baseVersion: number,
  slot: CopySlot = 'draft',
): boolean {
  try {
    const copy: LocalFindingsCopy = {
      doc,
      baseVersion,
      keptAt: new Date().toISOString(),
      tab: THIS_TAB,
    }
    localStorage.setItem(keyOf(caseId, slot), JSON.stringify(copy))
    return true
  } catch {
    return false
  }
}

/** Drops this tab's copy once the server has the text (or the writer is done merging). */
export function dropLocalCopy(caseId: number, slot: CopySlot = 'draft', anyTab = false): void {
  try {
    if (!anyTab && readLocalCopy(caseId, slot)?.tab !== THIS_TAB) return
    localStorage.removeItem(keyOf(caseId, slot))
  } catch {
    // nothing kept, nothing to drop
  }
}
