import type {
  Person,
  PersonCreate,
  PersonUpdate,
  PersonWithOneTimePassword,
} from '../../shared/schemas/people'
import { request } from './client'

export async function listPeople(): Promise<Person[]> {
  const { data } = await request<{ data: Person[] }>('GET', '/people')
  return data
}

export async function createPerson(person: PersonCreate): Promise<PersonWithOneTimePassword> {
  const { data } = await request<{ data: PersonWithOneTimePassword }>('POST', '/people', {
    body: person,
  })
  return data
}

export async function updatePerson(id: number, person: PersonUpdate): Promise<Person> {
  const { data } = await request<{ data: Person }>('PUT', `/people/${id}`, { body: person })
  return data
}

export async function resetPassword(id: number): Promise<PersonWithOneTimePassword> {
  const { data } = await request<{ data: PersonWithOneTimePassword }>(
    'POST',
    `/people/${id}/reset-password`,
  )
  return data
}

export async function resetSecondFactor(id: number): Promise<Person> {
  const { data } = await request<{ data: Person }>('POST', `/people/${id}/reset-second-factor`)
  return data
}
