import { can, type Actor, type CaseAction } from '../../../shared/access/policy'
import type { CaseState } from '../../../shared/workflow/case-states'
import { AppError, Forbidden } from '../../errors'
import type { CaseRecord } from '../cases/case-record'

/**
 * Refuses first who may never take the action on this case (403), then a case not in a state
 * that allows it (409 with `code`), so each refusal says what is really in the way.
 */
export function guardAction(
  actor: Actor,
  action: CaseAction,
  record: CaseRecord,
  states: readonly CaseState[],
  code: 'invalid_transition' | 'not_approved' = 'invalid_transition',
): void {
  if (!can(actor, action, { ...record, status: states[0] as CaseState }))
    throw new Forbidden('Your part in this case does not include that step.')
  if (!states.includes(record.status))
    throw new AppError(
      code,
      code === 'not_approved'
        ? 'Only an approved draft is issued. Submit it for review and have it approved first.'
        : `A case that is ${record.status.replace('_', ' ')} cannot take this step.`,
      { from: record.status },
    )
}
