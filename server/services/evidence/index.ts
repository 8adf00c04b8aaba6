import { createCustodyService } from './custody'
import { createHoldService } from './holds'
import { createNoticeService } from './notices'
import { createObservationService } from './observations'
import { createSampleService } from './samples'

/** Samples, custody, notices, holds and observations: the evidence of a case. */
export function createEvidenceServices(deps: { clock?: () => Date } = {}) {
  return {
    samples: createSampleService(deps),
    custody: createCustodyService(deps),
    notices: createNoticeService(deps),
    holds: createHoldService(),
    observations: createObservationService(),
  }
}

export type EvidenceServices = ReturnType<typeof createEvidenceServices>
