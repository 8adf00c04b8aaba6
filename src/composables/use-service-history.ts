import { computed, ref, watch, type Ref } from 'vue'
import {
  addServiceEvent,
  attachDocument,
  changeServiceEvent,
  listServiceEvents,
  removeServiceEvent,
} from '@/api/service-events'
import { todayIso } from '../../shared/schemas/dates'
import type {
  ServiceEvent,
  ServiceEventCreate,
  ServiceEventUpdate,
} from '../../shared/schemas/service-events'
import { serviceLife } from '../../shared/service-history/service-life'

/** A case's service history: the events, the life they add up to, and the changes to them. */
export function useServiceHistory(caseId: Ref<number>, failureDate: Ref<string | null>) {
  const events = ref<ServiceEvent[]>([])
  const loading = ref(false)

  async function load(): Promise<void> {
    loading.value = true
    try {
      events.value = await listServiceEvents(caseId.value)
    } finally {
      loading.value = false
    }
  }
  watch(caseId, () => void load(), { immediate: true })

  const life = computed(() =>
    serviceLife(events.value, { failureDate: failureDate.value, today: todayIso() }),
  )

  async function add(event: ServiceEventCreate): Promise<void> {
    await addServiceEvent(caseId.value, event)
    await load()
  }

  async function change(eventId: number, update: ServiceEventUpdate): Promise<void> {
    await changeServiceEvent(caseId.value, eventId, update)
    await load()
  }

  async function remove(event: ServiceEvent): Promise<void> {
    await removeServiceEvent(caseId.value, event.id, event.version)
    await load()
  }

  async function attach(event: ServiceEvent, file: File): Promise<void> {
    await attachDocument(caseId.value, event.id, file)
    await load()
  }

  return { events, loading, life, load, add, change, remove, attach }
}
