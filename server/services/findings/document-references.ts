import type { Knex } from 'knex'
import type { FindingsDocument } from '../../../shared/findings/document'
import { figuresOf } from '../../../shared/findings/figures'
import { opinionsOf } from '../../../shared/findings/flags'
import { AppError } from '../../errors'

const invalid = (path: string, message: string) =>
  new AppError('invalid_document', message, { path })

/** Figures show this case's photos and opinions cite this case's observations, nothing else. */
export async function checkReferences(db: Knex, caseId: number, doc: FindingsDocument) {
  const photoIds = [...new Set(figuresOf(doc).map((figure) => figure.attrs.photoId))]
  if (photoIds.length) {
    const found = (await db('photos')
      .where({ caseId })
      .whereIn('id', photoIds)
      .pluck('id')) as number[]
    const missing = photoIds.filter((id) => !found.includes(id))
    if (missing.length)
      throw invalid(
        'figure',
        `A figure shows a photo that is not in this case (${missing.join(', ')}).`,
      )
  }
  const cited = [...new Set(opinionsOf(doc).flatMap((opinion) => opinion.observations))]
  if (cited.length) {
    const found = (await db('observations')
      .where({ caseId })
      .whereIn('number', cited)
      .pluck('number')) as number[]
    const missing = cited.filter((n) => !found.includes(n))
    if (missing.length)
      throw invalid(
        'opinion',
        `An opinion cites observations this case does not have (${missing.map((n) => `O-${n}`).join(', ')}).`,
      )
  }
}

export async function withdrawnObservations(db: Knex, caseId: number): Promise<Set<number>> {
  const numbers = (await db('observations')
    .where({ caseId })
    .whereNotNull('withdrawnAt')
    .pluck('number')) as number[]
  return new Set(numbers)
}
