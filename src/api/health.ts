import { request } from './client'

export interface Health {
  status: string
  database: { connected: boolean; version?: string }
}

export async function fetchHealth(): Promise<Health> {
  const { data } = await request<{ data: Health }>('GET', '/health')
  return data
}
