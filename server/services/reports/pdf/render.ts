import { createRequire } from 'node:module'
import type { Node, NodeQueries, TDocumentDefinitions } from 'pdfmake/interfaces'
import { BlockWriter } from './blocks'
import { closingSections } from './closing'
import { figureImageKey } from './figure-block'
import { FONT_FAMILIES, FONT_FILES } from './fonts'
import type { ReportPdfInput } from './input'
import { footer, header, watermark } from './page-frame'
import { INK, PAGE, STYLES } from './styles'
import { titlePage } from './title-page'

// pdfmake is CommonJS exporting one instance; require() hands it over whole under ESM too.
const require = createRequire(import.meta.url)
const pdfmake = require('pdfmake') as typeof import('pdfmake')
pdfmake.setFonts(FONT_FAMILIES)
// Nothing is fetched and no file is read but the shipped fonts: images come as data inside the input.
pdfmake.setUrlAccessPolicy(() => false)
pdfmake.setLocalAccessPolicy((path) => FONT_FILES.has(path))

/** A heading is never left alone at the foot of a page: it moves to the page its text is on. */
function keepHeadingsWithText(node: Node, queries: NodeQueries): boolean {
  if (!node.headlineLevel) return false
  return queries.getFollowingNodesOnPage().length === 0 && queries.getNodesOnNextPage().length > 0
}

function images(input: ReportPdfInput): Record<string, string> {
  return Object.fromEntries(
    Object.entries(input.figures).map(([figureId, figure]) => [
      figureImageKey(figureId),
      `data:image/png;base64,${figure.png.toString('base64')}`,
    ]),
  )
}

export function reportDefinition(input: ReportPdfInput): TDocumentDefinitions {
  const writer = new BlockWriter(input)
  return {
    pageSize: 'A4',
    pageMargins: PAGE.margins,
    info: {
      title: `${input.report.number} ${input.report.draft ? 'draft' : `revision ${input.report.revision}`}: ${input.case.title}`,
      author: input.laboratory.name,
      subject: `Test report for case ${input.case.number}`,
      creator: 'Fractolog',
      producer: 'Fractolog',
      ...(input.report.issuedAt ? { creationDate: new Date(input.report.issuedAt) } : {}),
    },
    header: header(input),
    footer: footer(input),
    watermark: watermark(input),
    images: images(input),
    defaultStyle: { font: 'Text', fontSize: 10, color: INK.text },
    styles: STYLES,
    pageBreakBefore: keepHeadingsWithText,
    content: [...titlePage(input), ...writer.document(), ...closingSections(input)],
  }
}

/** The report as PDF bytes; pure: the same input always gives the same pages. */
export async function renderReportPdf(input: ReportPdfInput): Promise<Buffer> {
  return pdfmake.createPdf(reportDefinition(input)).getBuffer()
}
