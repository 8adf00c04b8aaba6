import type {
  Specification,
  SpecificationCreate,
  SpecificationUpdate,
} from '../../shared/schemas/specifications'
import { request } from './client'

/** The specification library: staff read it, administrators keep it. */
export async function listSpecifications(): Promise<Specification[]> {
  return (await request<{ data: Specification[] }>('GET', '/specifications')).data
}

export async function getSpecification(id: number): Promise<Specification> {
  return (await request<{ data: Specification }>('GET', `/specifications/${id}`)).data
}

export async function createSpecification(body: SpecificationCreate): Promise<Specification> {
  return (await request<{ data: Specification }>('POST', '/specifications', { body })).data
}

export async function updateSpecification(
  id: number,
  body: SpecificationUpdate,
): Promise<Specification> {
  return (await request<{ data: Specification }>('PATCH', `/specifications/${id}`, { body })).data
}
