import { computed, onMounted, reactive, ref } from 'vue'
import { useRouter } from 'vue-router'
import { createCase } from '@/api/cases'
import { listStaff, type StaffMember } from '@/api/staff'
import { useFormErrors } from '@/composables/use-form-errors'
import { useOrganisationsStore } from '@/stores/organisations'
import { useSessionStore } from '@/stores/session'
import type { Turnaround } from '../../shared/schemas/case-vocabulary'
import { keyPerContent } from '../../shared/api/idempotency'
import { CaseCreate } from '../../shared/schemas/cases'

function emptyToNull(text: string): string | null {
  return text.trim() === '' ? null : text
}

/** The new-case form: choices to fill it from, checks before sending, and the created case. */
export function useNewCaseForm() {
  const router = useRouter()
  const session = useSessionStore()
  const organisations = useOrganisationsStore()
  const { fieldErrors, formError, sending, validate, send, clearWhenEdited } = useFormErrors()
  const keyFor = keyPerContent()

  const form = reactive({
    title: '',
    organisationId: null as number | null,
    component: '',
    partNumber: '',
    material: '',
    turnaround: 'standard' as Turnaround,
    safetyCritical: false,
    receivedOn: '',
    leadInvestigatorId: null as number | null,
    failureDate: '',
    dueDate: '',
  })
  const staff = ref<StaffMember[]>([])
  clearWhenEdited(form)

  const investigators = computed(() =>
    staff.value.filter((member) => member.roles.includes('investigator')),
  )

  onMounted(async () => {
    const [members] = await Promise.all([listStaff(), organisations.ensureLoaded()])
    staff.value = members
    const me = session.user
    if (me && investigators.value.some((member) => member.id === me.id)) {
      form.leadInvestigatorId ??= me.id
    }
  })

  async function submit(): Promise<void> {
    const newCase = validate(CaseCreate, {
      ...form,
      partNumber: emptyToNull(form.partNumber),
      failureDate: emptyToNull(form.failureDate),
      receivedOn: emptyToNull(form.receivedOn),
      dueDate: emptyToNull(form.dueDate),
    })
    if (!newCase) return
    await send(async () => {
      const created = await createCase(newCase, keyFor(newCase))
      await router.push({ name: 'case', params: { id: created.id } })
    })
  }

  return { form, fieldErrors, formError, sending, investigators, organisations, submit }
}
