import { computed, reactive, ref } from 'vue'
import { ApiError } from '@/api/client'
import { useFormErrors } from '@/composables/use-form-errors'
import { useCaseFileStore } from '@/stores/case-file'
import type { Mechanism } from '../../shared/schemas/case-vocabulary'
import {
  caseDateIssues,
  CaseCreate,
  CaseUpdate,
  type CaseDetail,
  type CaseFields,
  type InterestedParty,
} from '../../shared/schemas/cases'
import { todayIso } from '../../shared/schemas/dates'

type DateField = 'receivedOn' | 'failureDate' | 'dueDate'

/** The form's working copy: dates as the date input holds them, mechanisms as a pick list. */
export interface CaseForm extends Omit<CaseFields, 'mechanisms' | DateField> {
  receivedOn: string
  failureDate: string
  dueDate: string
  mechanismKeys: Mechanism[]
  primaryMechanism: Mechanism | null
}

const EDITABLE = Object.keys(CaseCreate.shape) as (keyof CaseFields)[]

function formOf(detail: CaseDetail): CaseForm {
  const { mechanisms, receivedOn, failureDate, dueDate } = detail
  const copy = (key: keyof CaseFields) => [key, JSON.parse(JSON.stringify(detail[key]))]
  return {
    ...(Object.fromEntries(EDITABLE.map(copy)) as CaseForm),
    receivedOn: receivedOn ?? '',
    failureDate: failureDate ?? '',
    dueDate: dueDate ?? '',
    mechanismKeys: mechanisms.map((entry) => entry.mechanism),
    primaryMechanism: mechanisms.find((entry) => entry.primary)?.mechanism ?? null,
  }
}

function fieldsOf(form: CaseForm): CaseFields {
  const { mechanismKeys, primaryMechanism, receivedOn, failureDate, dueDate, ...rest } = form
  const single = mechanismKeys.length === 1 ? mechanismKeys[0] : null
  return {
    ...rest,
    contactEmail: rest.contactEmail || null,
    interestedParties: rest.interestedParties.map((party) => ({
      ...party,
      organisation: party.organisation || null,
      email: party.email || null,
    })),
    receivedOn: receivedOn || null,
    failureDate: failureDate || null,
    dueDate: dueDate || null,
    mechanisms: mechanismKeys.map((mechanism) => ({
      mechanism,
      primary: mechanism === (primaryMechanism ?? single),
    })),
  }
}

/** Only what the person changed, against the record the form started from. */
function changesBetween(base: CaseFields, edited: CaseFields): Partial<CaseFields> {
  const keys = Object.keys(edited) as (keyof CaseFields)[]
  const changed = keys.filter((key) => JSON.stringify(base[key]) !== JSON.stringify(edited[key]))
  return Object.fromEntries(changed.map((key) => [key, edited[key]])) as Partial<CaseFields>
}

/**
 * Editing the case record against the version it was read at. When someone else saved first,
 * the server's current record is kept beside the person's edits, which stay in the form to retry.
 */
export function useCaseRecordForm(start: CaseDetail, done: () => void) {
  const caseFile = useCaseFileStore()
  const errors = useFormErrors()
  const base = ref<CaseDetail>(start)
  const form = reactive<CaseForm>(formOf(start))
  const conflict = ref<CaseDetail>()
  errors.clearWhenEdited(form as unknown as Record<string, unknown>)

  /** What the other person changed, as field names, to show beside the conflict. */
  const changedMeanwhile = computed(() =>
    conflict.value
      ? Object.keys(changesBetween(fieldsOf(formOf(base.value)), fieldsOf(formOf(conflict.value))))
      : [],
  )

  const pending = computed(() => changesBetween(fieldsOf(formOf(base.value)), fieldsOf(form)))

  function check(): CaseUpdate | undefined {
    const change = errors.validate(CaseUpdate, { ...pending.value, version: base.value.version })
    if (!change) return undefined
    const issues = caseDateIssues(fieldsOf(form), todayIso())
    if (issues.length === 0) return change
    errors.fieldErrors.value = Object.fromEntries(issues.map((i) => [i.path, i.message]))
    return undefined
  }

  async function submit(): Promise<void> {
    const change = check()
    if (!change) return
    if (Object.keys(change).length === 1) return done()
    const saved = await errors.send(async () => {
      try {
        await caseFile.save(change)
      } catch (error) {
        noticeConflict(error)
        throw error
      }
    })
    if (saved) done()
  }

  /** A version conflict keeps the edits for another try, beside the record as it is now. */
  function noticeConflict(error: unknown): void {
    if (error instanceof ApiError && error.code === 'version_conflict') {
      const current = (error.details as { current?: CaseDetail } | undefined)?.current
      if (current) conflict.value = current
    }
  }

  /** Keep my edits, now against the record as it is: the next save overwrites only my fields. */
  function keepMine(): void {
    if (!conflict.value) return
    const mine = pending.value
    base.value = conflict.value
    caseFile.adopt(conflict.value)
    Object.assign(form, formOf(conflict.value), formOfChanges(mine))
    conflict.value = undefined
    errors.clear()
  }

  function takeTheirs(): void {
    if (!conflict.value) return
    base.value = conflict.value
    caseFile.adopt(conflict.value)
    Object.assign(form, formOf(conflict.value))
    conflict.value = undefined
    errors.clear()
  }

  function addParty(): void {
    form.interestedParties.push({ name: '', organisation: null, email: null, role: 'owner' })
  }

  function removeParty(party: InterestedParty): void {
    form.interestedParties.splice(form.interestedParties.indexOf(party), 1)
  }

  return {
    form,
    ...errors,
    conflict,
    changedMeanwhile,
    submit,
    keepMine,
    takeTheirs,
    addParty,
    removeParty,
  }
}

function formOfChanges(changes: Partial<CaseFields>): Partial<CaseForm> {
  const { mechanisms, receivedOn, failureDate, dueDate, ...rest } = changes
  const partial: Partial<CaseForm> = { ...rest }
  if (receivedOn !== undefined) partial.receivedOn = receivedOn ?? ''
  if (failureDate !== undefined) partial.failureDate = failureDate ?? ''
  if (dueDate !== undefined) partial.dueDate = dueDate ?? ''
  if (mechanisms) {
    partial.mechanismKeys = mechanisms.map((entry) => entry.mechanism)
    partial.primaryMechanism = mechanisms.find((entry) => entry.primary)?.mechanism ?? null
  }
  return partial
}
