import type { Node, NodeQueries, TDocumentDefinitions } from 'pdfmake/interfaces'
import { BlockWriter } from './blocks'
import { closingSections } from './closing'
import { figureImages } from './figure-images'
import { FONT_FAMILIES, loadFontFiles } from './fonts'
import type { ReportPdfInput } from './input'
import { footer, header, watermark } from './page-frame'
import { printPdf } from './pdfmake-printer'
import { INK, PAGE, STYLES } from './styles'
import { titlePage } from './title-page'

/** A heading is never left alone at the foot of a page: it moves to the page its text is on. */
function keepHeadingsWithText(node: Node, queries: NodeQueries): boolean {
  if (!node.headlineLevel) return false
  return queries.getFollowingNodesOnPage().length === 0 && queries.getNodesOnNextPage().length > 0
}

/** The whole report as pdfmake's document; figures are named by keys of `images`. */
export function reportDefinition(
  input: ReportPdfInput,
  images: Record<string, string>,
): TDocumentDefinitions {
  const writer = new BlockWriter(input)
  const { report } = input
  return {
    pageSize: 'A4',
    pageMargins: PAGE.margins,
    info: {
      title: `${report.number} ${report.draft ? 'draft' : `revision ${report.revision}`}: ${input.case.title}`,
      author: input.laboratory.name,
      subject: `Test report for case ${input.case.number}`,
      creator: 'Fractolog',
      producer: 'Fractolog',
      ...(report.issuedAt ? { creationDate: new Date(report.issuedAt) } : {}),
    },
    header: header(input),
    footer: footer(input),
    watermark: watermark(input),
    images,
    defaultStyle: { font: 'Text', fontSize: 10, color: INK.text },
    styles: STYLES,
    pageBreakBefore: keepHeadingsWithText,
    content: [...titlePage(input), ...writer.document(), ...closingSections(input)],
  }
}

/** The report as PDF bytes: the same input always gives the same pages. */
export async function renderReportPdf(input: ReportPdfInput): Promise<Buffer> {
  const figures = await figureImages(input)
  const files = new Map([...loadFontFiles(), ...figures])
  const images = Object.fromEntries([...figures.keys()].map((key) => [key, key]))
  return printPdf(reportDefinition(input, images), FONT_FAMILIES, files)
}
