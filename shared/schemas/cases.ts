import { z } from 'zod'
import { CASE_STATES } from '../workflow/case-states'
import { Id, idOf, IsoDate, PageQuery, trimmed } from './common'

export const CaseStatus = z.enum(CASE_STATES)
export const PRIORITIES = ['low', 'normal', 'high', 'urgent'] as const
export const Priority = z.enum(PRIORITIES)
export type Priority = z.infer<typeof Priority>

export const CASE_NUMBER_PATTERN = /^FL-\d{4}-\d{4}$/

export const CaseCreate = z.strictObject({
  title: trimmed(191, 'Title'),
  organisationId: idOf('Choose the client organisation.'),
  component: trimmed(191, 'Component'),
  partNumber: z
    .string()
    .trim()
    .max(100, 'Part number is at most 100 characters.')
    .nullable()
    .default(null),
  material: trimmed(191, 'Material as specified'),
  priority: Priority.default('normal'),
  leadInvestigatorId: idOf('Choose an investigator from the list.').nullable().default(null),
  failureDate: IsoDate.nullable().default(null),
  dueDate: IsoDate.nullable().default(null),
})
export type CaseCreate = z.infer<typeof CaseCreate>

export const CaseStatusChange = z.strictObject({ status: CaseStatus })
export type CaseStatusChange = z.infer<typeof CaseStatusChange>

export const CaseListQuery = z.strictObject({
  ...PageQuery,
  status: CaseStatus.optional(),
  organisationId: Id.optional(),
  q: z.string().trim().max(100).optional(),
})
export type CaseListQuery = z.infer<typeof CaseListQuery>

export interface CaseSummary {
  id: number
  number: string
  title: string
  status: z.infer<typeof CaseStatus>
  priority: Priority
  organisationId: number
  organisationName: string
  component: string
  material: string
  leadInvestigatorId: number | null
  leadInvestigatorName: string | null
  dueDate: string | null
  createdAt: string
  updatedAt: string
}

export interface CaseDetail extends CaseSummary {
  partNumber: string | null
  failureDate: string | null
}
