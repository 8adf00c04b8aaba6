import type { Knex } from 'knex'
import type { FieldIssue } from '../../../shared/api/errors'
import type { CaseFields } from '../../../shared/schemas/cases'
import type { SpecificationBand } from '../../../shared/schemas/specifications'
import { bandCovers, bandForSize, describeBand } from '../../../shared/specifications/size-bands'

type Link = Pick<CaseFields, 'specificationId' | 'specificationBand' | 'sectionSizeMm'>

export const LINK_FIELDS: readonly (keyof CaseFields)[] = [
  'specificationId',
  'specificationBand',
  'sectionSizeMm',
]

async function bandsOf(db: Knex, id: number): Promise<SpecificationBand[] | null> {
  const row = (await db('specifications').where({ id }).first('bands')) as
    { bands: string | SpecificationBand[] } | undefined
  if (!row) return null
  return typeof row.bands === 'string' ? (JSON.parse(row.bands) as SpecificationBand[]) : row.bands
}

/** Why a section size does not fit the chosen band, naming the band that would. */
function outOfBand(bands: SpecificationBand[], chosen: SpecificationBand, sizeMm: number): string {
  const fitting = bandForSize(bands, sizeMm)
  const instead =
    fitting === null
      ? 'the record has no band for it'
      : `choose the band ${describeBand(bands[fitting]!)}`
  return `A section of ${sizeMm} mm is outside the band chosen (${describeBand(chosen)}): ${instead}.`
}

/**
 * The material's link: the record exists, the band is one of its bands, and the part's
 * governing section size (when given) lies within that band.
 */
export async function materialLinkIssues(db: Knex, link: Link): Promise<FieldIssue[]> {
  const { specificationId, specificationBand, sectionSizeMm } = link
  if (specificationId === null) {
    return specificationBand === null
      ? []
      : [{ path: 'specificationBand', message: 'Choose a specification record first.' }]
  }
  const bands = await bandsOf(db, specificationId)
  if (bands === null)
    return [{ path: 'specificationId', message: 'No such specification record in the library.' }]
  const chosen = specificationBand === null ? undefined : bands[specificationBand]
  if (chosen === undefined) {
    const message = `Choose one of the record’s ${bands.length} size bands.`
    return [{ path: 'specificationBand', message }]
  }
  if (sectionSizeMm !== null && !bandCovers(chosen, sectionSizeMm))
    return [{ path: 'specificationBand', message: outOfBand(bands, chosen, sectionSizeMm) }]
  return []
}
