import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import * as organisationsApi from '@/api/organisations'
import type {
  Organisation,
  OrganisationCreate,
  OrganisationUpdate,
} from '../../shared/schemas/organisations'

/** Client organisations: listed by the admin pages and chosen from in case and person forms. */
export const useOrganisationsStore = defineStore('organisations', () => {
  const organisations = ref<Organisation[]>([])
  const loaded = ref(false)

  const active = computed(() => organisations.value.filter((organisation) => organisation.active))
  const byId = computed(
    () => new Map(organisations.value.map((organisation) => [organisation.id, organisation])),
  )

  async function load(): Promise<void> {
    organisations.value = await organisationsApi.listOrganisations()
    loaded.value = true
  }

  async function ensureLoaded(): Promise<void> {
    if (!loaded.value) await load()
  }

  function nameOf(id: number | null): string {
    return id === null ? '' : (byId.value.get(id)?.name ?? '')
  }

  function keepSorted(changed: Organisation): void {
    const others = organisations.value.filter((organisation) => organisation.id !== changed.id)
    organisations.value = [...others, changed].sort((a, b) => a.name.localeCompare(b.name))
  }

  async function create(organisation: OrganisationCreate): Promise<Organisation> {
    const created = await organisationsApi.createOrganisation(organisation)
    keepSorted(created)
    return created
  }

  async function update(id: number, organisation: OrganisationUpdate): Promise<Organisation> {
    const updated = await organisationsApi.updateOrganisation(id, organisation)
    keepSorted(updated)
    return updated
  }

  function $reset(): void {
    organisations.value = []
    loaded.value = false
  }

  return { organisations, loaded, active, load, ensureLoaded, nameOf, create, update, $reset }
})
