import { useConfirm } from 'primevue/useconfirm'
import { useToast } from 'primevue/usetoast'
import { onMounted, ref } from 'vue'
import * as peopleApi from '@/api/people'
import type { PersonDialogSave } from '@/components/people/PersonDialog.vue'
import { useOrganisationsStore } from '@/stores/organisations'
import type { Person, PersonWithOneTimePassword } from '../../shared/schemas/people'

/** The people page: the list, adding and editing, (de)activating, password and second-factor resets. */
export function usePeople() {
  const confirm = useConfirm()
  const toast = useToast()
  const organisations = useOrganisationsStore()

  const people = ref<Person[]>([])
  const loading = ref(false)
  /** The answer that carries a one-time password, held only while its dialog is open. */
  const issued = ref<PersonWithOneTimePassword | null>(null)

  async function load(): Promise<void> {
    loading.value = true
    try {
      const [list] = await Promise.all([peopleApi.listPeople(), organisations.ensureLoaded()])
      people.value = list
    } finally {
      loading.value = false
    }
  }
  onMounted(load)

  function replace(person: Person): void {
    const index = people.value.findIndex((existing) => existing.id === person.id)
    if (index === -1) people.value = [...people.value, person]
    else people.value.splice(index, 1, person)
  }

  async function save(change: PersonDialogSave): Promise<Person | PersonWithOneTimePassword> {
    if (change.kind === 'update') {
      const updated = await peopleApi.updatePerson(change.id, change.person)
      replace(updated)
      return updated
    }
    const created = await peopleApi.createPerson(change.person)
    replace(created.person)
    issued.value = created
    return created
  }

  function resetPassword(person: Person): void {
    confirm.require({
      header: 'Reset password',
      message: `Give ${person.name} a new one-time password? The current password stops working.`,
      acceptProps: { label: 'Reset password', 'data-testid': 'confirm-reset' },
      rejectProps: { label: 'Cancel', severity: 'secondary', outlined: true },
      accept: async () => {
        const answer = await peopleApi.resetPassword(person.id)
        replace(answer.person)
        issued.value = answer
      },
    })
  }

  function resetSecondFactor(person: Person): void {
    confirm.require({
      header: 'Reset two-factor sign-in',
      message: `Remove ${person.name}’s second factor? They set up a new one at their next sign-in.`,
      acceptProps: { label: 'Reset', 'data-testid': 'confirm-reset-second-factor' },
      rejectProps: { label: 'Cancel', severity: 'secondary', outlined: true },
      accept: async () => {
        replace(await peopleApi.resetSecondFactor(person.id))
        toast.add({ severity: 'success', summary: 'Second factor removed', life: 4000 })
      },
    })
  }

  function setActive(person: Person, active: boolean): void {
    const change = async () => {
      const { email, name, roles, organisationId } = person
      const update = { email, name, roles, organisationId, active }
      const updated = await peopleApi.updatePerson(person.id, update)
      replace(updated)
      const summary = `${person.name} ${active ? 'can sign in again' : 'is deactivated'}`
      toast.add({ severity: 'success', summary, life: 4000 })
    }
    if (active) {
      void change()
      return
    }
    confirm.require({
      header: 'Deactivate person',
      message: `${person.name} will no longer be able to sign in. Their work stays in the cases.`,
      acceptProps: { label: 'Deactivate', severity: 'danger', 'data-testid': 'confirm-deactivate' },
      rejectProps: { label: 'Cancel', severity: 'secondary', outlined: true },
      accept: change,
    })
  }

  return {
    people,
    loading,
    issued,
    organisations,
    save,
    resetPassword,
    resetSecondFactor,
    setActive,
  }
}
