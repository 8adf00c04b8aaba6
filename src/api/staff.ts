import type { StaffRole } from '../../shared/schemas/roles'
import { request } from './client'

/** An active staff member as the staff directory lists them. */
export interface StaffMember {
  id: number
  name: string
  roles: StaffRole[]
}

export async function listStaff(): Promise<StaffMember[]> {
  const { data } = await request<{ data: StaffMember[] }>('GET', '/staff')
  return data
}
