import type { LaboratorySettings, LaboratorySettingsUpdate } from '../../shared/schemas/laboratory'
import type { NoticeSetting, NoticeSettingsUpdate } from '../../shared/schemas/notice-settings'
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

export async function getNoticeSettings(): Promise<NoticeSetting[]> {
  const { data } = await request<{ data: NoticeSetting[] }>('GET', '/settings/notices')
  return data
}

export async function saveNoticeSettings(update: NoticeSettingsUpdate): Promise<NoticeSetting[]> {
  const { data } = await request<{ data: NoticeSetting[] }>('PUT', '/settings/notices', {
    body: update,
  })
  return data
}
