import type {
  Specimen,
  SpecimenCreate,
  TensileRecordView,
} from '../../shared/schemas/mechanical-tests'
import type { CaseOverallConformity } from '../../shared/specifications/case-conformity'
import type { SpecimenResult, SpecimenSummary } from '../../shared/tensile'
import { request } from './client'

const base = (caseId: number) => `/cases/${caseId}`

export interface SpecimenList {
  specimens: Specimen[]
  summary: { specimens: number; properties: SpecimenSummary }
  /** the case's verdict against its linked record and band */
  conformity: CaseOverallConformity | null
}

export async function listSpecimens(caseId: number): Promise<SpecimenList> {
  const { data } = await request<{ data: SpecimenList }>('GET', `${base(caseId)}/specimens`)
  return data
}

export async function addSpecimen(caseId: number, specimen: Partial<SpecimenCreate>) {
  const path = `${base(caseId)}/specimens`
  const { data } = await request<{ data: Specimen }>('POST', path, { body: specimen })
  return data
}

export async function uploadTensileRecord(
  caseId: number,
  specimenId: number,
  file: File,
  options: Record<string, string>,
) {
  const form = new FormData()
  form.append('options', JSON.stringify(options))
  form.append('file', file)
  const path = `${base(caseId)}/specimens/${specimenId}/tensile-records`
  const { data } = await request<{ data: { id: number; sha256: string; result: SpecimenResult } }>(
    'POST',
    path,
    { form },
  )
  return data
}

const recordPath = (caseId: number, recordId: number, action: string) =>
  `${base(caseId)}/tensile-records/${recordId}/${action}`

export async function recomputeTensileRecord(
  caseId: number,
  record: TensileRecordView,
  options: Record<string, string>,
) {
  const body = { options, version: record.version }
  const path = recordPath(caseId, record.id, 'recompute')
  return (await request<{ data: TensileRecordView }>('POST', path, { body })).data
}

export async function confirmTensileRecord(caseId: number, record: TensileRecordView) {
  const path = recordPath(caseId, record.id, 'confirm')
  const body = { version: record.version }
  return (await request<{ data: TensileRecordView }>('POST', path, { body })).data
}

export async function invalidateTensileRecord(
  caseId: number,
  record: TensileRecordView,
  reason: string,
  note: string | null,
  retestRecordId: number | null,
) {
  const path = recordPath(caseId, record.id, 'invalidate')
  const body = { reason, note, retestRecordId, version: record.version }
  return (await request<{ data: TensileRecordView }>('POST', path, { body })).data
}

/** The original file as uploaded, for drawing its curve in the browser. */
export async function fetchTensileRecordText(caseId: number, recordId: number): Promise<string> {
  const response = await fetch(`/api${recordPath(caseId, recordId, 'file')}`, {
    credentials: 'same-origin',
  })
  if (!response.ok) throw new Error(`The original record could not be read (${response.status}).`)
  return response.text()
}
