import type { Content } from 'pdfmake/interfaces'
import type { Opinion, Paragraph } from '../../../../shared/findings/document'
import { observationNumber } from '../../../../shared/schemas/observations'
import { INK } from './styles'
import { runs } from './text-runs'

/** The words that set an opinion apart, as the web page shows them. */
export function opinionBasis(observations: readonly number[]): string {
  const cited = observations.map(observationNumber).join(', ')
  return cited ? `Opinion, based on ${cited}` : 'Opinion (cites no observation)'
}

/** An opinion in a shaded box with a rule on its left, naming the observations it rests on. */
export function opinionBlock(opinion: Opinion, paragraph: (p: Paragraph) => Content): Content {
  const assumptions = opinion.attrs.assumptions
    ? [
        {
          text: runs(`Assumptions: ${opinion.attrs.assumptions}`, { italics: true }),
          style: 'note',
        },
      ]
    : []
  const inside: Content = {
    stack: [
      {
        text: runs(opinionBasis(opinion.attrs.observations), { bold: true }),
        style: 'label',
        margin: [0, 0, 0, 3],
      },
      ...opinion.content.map(paragraph),
      ...assumptions,
    ],
  }
  return {
    table: { widths: ['*'], body: [[inside]] },
    layout: {
      fillColor: () => INK.opinion,
      hLineWidth: () => 0,
      vLineWidth: (i: number) => (i === 0 ? 2.5 : 0),
      vLineColor: () => INK.opinionRule,
      paddingLeft: () => 10,
      paddingRight: () => 8,
      paddingTop: () => 6,
      paddingBottom: () => 4,
    },
    margin: [0, 4, 0, 10],
  }
}
