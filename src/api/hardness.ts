import type { HardnessCreate, HardnessSet } from '../../shared/schemas/hardness'
import { request } from './client'

export async function listHardness(caseId: number): Promise<HardnessSet[]> {
  const { data } = await request<{ data: HardnessSet[] }>('GET', `/cases/${caseId}/hardness`)
  return data
}

export async function recordHardness(caseId: number, set: Partial<HardnessCreate>) {
  const path = `/cases/${caseId}/hardness`
  const { data } = await request<{ data: HardnessSet }>('POST', path, { body: set })
  return data
}
