import { describe, expect, it } from 'vitest'
import { can, organisationScope, type Action, type Actor } from '../../server/auth/policy'
import type { Role } from '../../shared/schemas/roles'

const actor = (role: Role, organisationId: number | null = null): Actor => ({
  id: 1,
  roles: [role],
  organisationId,
})

// Every role × action, without a case: the expected answer is written out in full.
const TABLE: Record<Action, Record<Role, boolean>> = {
  'people.manage': { admin: true, investigator: false, lab: false, reviewer: false, client: false },
  'organisations.manage': {
    admin: true,
    investigator: false,
    lab: false,
    reviewer: false,
    client: false,
  },
  'organisations.list': {
    admin: true,
    investigator: true,
    lab: true,
    reviewer: true,
    client: true,
  },
  'staff.list': { admin: true, investigator: true, lab: true, reviewer: true, client: false },
  'cases.list': { admin: true, investigator: true, lab: true, reviewer: true, client: true },
  'case.create': { admin: true, investigator: true, lab: false, reviewer: false, client: false },
  'case.view': { admin: true, investigator: true, lab: true, reviewer: true, client: true },
  'case.changeStatus': {
    admin: true,
    investigator: true,
    lab: false,
    reviewer: false,
    client: false,
  },
}

describe('access policy: role × action', () => {
  for (const [action, byRole] of Object.entries(TABLE) as [Action, Record<Role, boolean>][]) {
    for (const [role, expected] of Object.entries(byRole) as [Role, boolean][]) {
      it(`${role} ${expected ? 'may' : 'may not'} ${action}`, () => {
        expect(can(actor(role, role === 'client' ? 7 : null), action)).toBe(expected)
      })
    }
  }
})

describe('access policy: a case belongs to an organisation', () => {
  const ownCase = { organisationId: 7 }
  const otherCase = { organisationId: 8 }

  it('lets staff reach every organisation’s case', () => {
    for (const role of ['admin', 'investigator', 'lab', 'reviewer'] as const) {
      expect(can(actor(role), 'case.view', otherCase)).toBe(true)
    }
  })

  it('lets a client reach only their own organisation’s case', () => {
    expect(can(actor('client', 7), 'case.view', ownCase)).toBe(true)
    expect(can(actor('client', 7), 'case.view', otherCase)).toBe(false)
    expect(can(actor('client', null), 'case.view', ownCase)).toBe(false)
  })

  it('combines roles: a reviewer who is also an investigator may create cases', () => {
    expect(
      can({ id: 2, roles: ['reviewer', 'investigator'], organisationId: null }, 'case.create'),
    ).toBe(true)
  })

  it('limits a client’s lists to their organisation, and staff lists to none', () => {
    expect(organisationScope(actor('client', 7))).toBe(7)
    expect(organisationScope(actor('client', null))).toBe(-1)
    expect(organisationScope(actor('lab'))).toBeUndefined()
  })
})
