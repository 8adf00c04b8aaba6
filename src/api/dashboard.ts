import type { Dashboard } from '../../shared/schemas/dashboard'
import { request } from './client'

export async function fetchDashboard(): Promise<Dashboard> {
  const { data } = await request<{ data: Dashboard }>('GET', '/dashboard')
  return data
}
