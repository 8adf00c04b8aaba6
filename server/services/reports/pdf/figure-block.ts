import type { Content } from 'pdfmake/interfaces'
import type { Figure } from '../../../../shared/findings/document'
import { figureLabel } from '../../../../shared/findings/figures'
import { CONTENT_HEIGHT, CONTENT_WIDTH, INK } from './styles'
import { runs } from './text-runs'

/** The images dictionary's key for a figure's PNG. */
export const figureImageKey = (figureId: string) => `figure:${figureId}`

/**
 * "Figure n. caption" under the figure's image, scaled to the text width and to at most about
 * two thirds of the page, kept on one page with its caption.
 */
export function figureBlock(
  figure: Figure,
  numbers: Map<string, number>,
  image: { png: Buffer } | undefined,
): Content {
  const label = figureLabel(numbers, figure.attrs.figureId)
  const picture: Content = image
    ? {
        image: figureImageKey(figure.attrs.figureId),
        fit: [CONTENT_WIDTH, CONTENT_HEIGHT * 0.62],
        alignment: 'center',
      }
    : {
        table: {
          widths: ['*'],
          body: [
            [
              {
                text: runs('The image of this figure could not be read.'),
                color: INK.draft,
                margin: [8, 24, 8, 24],
                alignment: 'center',
              },
            ],
          ],
        },
      }
  const caption = [
    ...runs(`${label}. `, { bold: true, italics: false }),
    ...runs(figure.attrs.caption),
  ]
  return {
    stack: [picture, { text: caption, style: 'caption' }],
    unbreakable: true,
    margin: [0, 6, 0, 0],
  }
}
