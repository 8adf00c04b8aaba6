import type { LaboratorySettings, LaboratorySettingsUpdate } from '../../shared/schemas/laboratory'
import { request } from './client'

export async function getLaboratorySettings(): Promise<LaboratorySettings> {
  const { data } = await request<{ data: LaboratorySettings }>('GET', '/settings/laboratory')
  return data
}

export async function saveLaboratorySettings(
  settings: LaboratorySettingsUpdate,
): Promise<LaboratorySettings> {
  const { data } = await request<{ data: LaboratorySettings }>('PUT', '/settings/laboratory', {
    body: settings,
  })
  return data
}
