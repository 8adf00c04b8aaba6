import type { Content, TableCell } from 'pdfmake/interfaces'
import { REPORT_CAUTIONS } from '../../../../shared/reports/cautions'
import { observationNumber } from '../../../../shared/schemas/observations'
import type { ReportPdfInput } from './input'
import { TABLE_LAYOUT } from './table-layout'
import { runs } from './text-runs'

const heading = (text: string): Content => ({ text: runs(text), style: 'h2', headlineLevel: 2 })

/** The facts the opinions cite, by number; a withdrawn one stays listed, marked so. */
function observationRegister(observations: ReportPdfInput['observations']): Content[] {
  if (observations.length === 0) return []
  const header: TableCell[] = ['No.', 'Observation (fact seen or measured)', 'Status'].map(
    (title) => ({ text: runs(title), style: 'tableHeader' }),
  )
  const rows: TableCell[][] = observations.map((observation) => [
    { text: runs(observationNumber(observation.number)), bold: true },
    { text: runs(observation.text), decoration: observation.withdrawn ? 'lineThrough' : undefined },
    { text: runs(observation.withdrawn ? 'Withdrawn' : 'Recorded') },
  ])
  return [
    heading('Register of observations'),
    {
      text: runs(
        'Observations are facts as seen or measured. Opinions in this report are set apart in shaded boxes and cite the observations they rest on by number.',
      ),
      style: 'note',
    },
    {
      table: { headerRows: 1, widths: [36, '*', 60], body: [header, ...rows] },
      layout: TABLE_LAYOUT,
      style: 'table',
    },
  ]
}

function conformityStatement(lines: readonly string[]): Content[] {
  if (lines.length === 0) return []
  return [
    heading('Conformity statement'),
    ...lines.map((line): Content => ({ text: runs(line), style: 'body' })),
  ]
}

function cautions(): Content[] {
  return [
    heading('Cautions'),
    // numbered by hand, as columns: the number reads before its caution when the text is copied
    ...REPORT_CAUTIONS.map((caution, index): Content => ({
      columns: [
        { width: 16, text: runs(`${index + 1}.`) },
        { width: '*', text: runs(caution) },
      ],
      style: 'body',
    })),
  ]
}

function issueLine(input: ReportPdfInput): Content {
  const authoriser = input.people.authoriser
  const text =
    input.report.draft || !authoriser
      ? 'Not issued: this draft preview carries no authorisation.'
      : `Authorised for issue by ${authoriser.name}, ${authoriser.role}, on ${input.dates.issued ?? '—'}.`
  return { text: runs(text), bold: true, margin: [0, 16, 0, 4] }
}

/** What follows the findings: the register, the conformity statement, cautions and the sign-off. */
export function closingSections(input: ReportPdfInput): Content[] {
  return [
    ...observationRegister(input.observations),
    ...conformityStatement(input.conformity),
    ...cautions(),
    issueLine(input),
    { text: runs('End of report'), style: 'label', alignment: 'center', margin: [0, 12, 0, 0] },
  ]
}
