/*
 * The cautions every report of the engine carries, in one place so the command line, the web
 * page and the written report say the same thing.
 */

/** Beside every verdict: a failed part's specimens are not the product's test pieces. */
export const VERDICT_CAUTION =
  'Indicative only: specimens cut from a failed part are not the product’s test pieces ' +
  '(their location, orientation and size differ from those the specification prescribes).'

const MEASUREMENT =
  'Computed from the record as given: results are only as good as the specimen measurements and ' +
  'the calibration of the machine and extensometer. Conformity follows the stated decision rule.'

const DEFERENCE =
  'Conclusions defer to the applicable codes, the client’s specifications and the judgment of ' +
  'competent, authorised (where required, licensed) professionals.'

export interface CitedSpecification {
  designation: string
  standard: string
  source: string
  /** The edition the contract or the client's specification cites; null when not stated. */
  edition: string | null
}

function editionSentence(spec: CitedSpecification): string {
  const limits = `The limits compared are those of the ${spec.designation} record (${spec.source})`
  if (spec.edition === null)
    return (
      `${limits}; no edition of ${spec.standard} was named: confirm them against the edition ` +
      'the contract or the client’s specification cites, and state that edition with the analysis.'
    )
  return `${limits}; confirm them against ${spec.standard}, edition ${spec.edition}, the edition the contract or the client’s specification cites.`
}

/** The closing caution of a report, naming the cited edition when a specification was compared. */
export function closingCaution(spec: CitedSpecification | null): string {
  return [MEASUREMENT, ...(spec === null ? [] : [editionSentence(spec)]), DEFERENCE].join(' ')
}
