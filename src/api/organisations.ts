import type {
  Organisation,
  OrganisationCreate,
  OrganisationUpdate,
} from '../../shared/schemas/organisations'
import { request } from './client'

export async function listOrganisations(): Promise<Organisation[]> {
  const { data } = await request<{ data: Organisation[] }>('GET', '/organisations')
  return data
}

export async function createOrganisation(organisation: OrganisationCreate): Promise<Organisation> {
  const { data } = await request<{ data: Organisation }>('POST', '/organisations', {
    body: organisation,
  })
  return data
}

export async function updateOrganisation(
  id: number,
  organisation: OrganisationUpdate,
): Promise<Organisation> {
  const { data } = await request<{ data: Organisation }>('PUT', `/organisations/${id}`, {
    body: organisation,
  })
  return data
}
