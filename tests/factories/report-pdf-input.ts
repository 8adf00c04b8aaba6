import sharp from 'sharp'
import type { Block, FindingsDocument, Paragraph } from '../../shared/findings/document'
import type { ReportPdfInput } from '../../server/services/reports/pdf'

/** A figure-like PNG: a dark field, a bright elliptical "fracture face" and a scale-bar box. */
export async function figurePng(seed: number, width = 1200, height = 900): Promise<Buffer> {
  const hue = (seed * 47) % 360
  const svg =
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}">` +
    `<rect width="100%" height="100%" fill="hsl(${hue},20%,18%)"/>` +
    `<ellipse cx="${width / 2}" cy="${height / 2}" rx="${width / 3}" ry="${height / 3}" fill="hsl(${hue},15%,62%)"/>` +
    `<circle cx="${width / 2.6}" cy="${height / 2.4}" r="${height / 12}" fill="none" stroke="#ffd400" stroke-width="6"/>` +
    `<rect x="${width - 260}" y="${height - 70}" width="200" height="14" fill="#ffffff"/></svg>`
  return sharp(Buffer.from(svg)).removeAlpha().png().toBuffer()
}

export const text = (value: string) => ({ type: 'text' as const, text: value })
export const paragraph = (...parts: (string | object)[]): Paragraph =>
  ({
    type: 'paragraph',
    content: parts.map((part) => (typeof part === 'string' ? text(part) : part)),
  }) as Paragraph
export const heading = (
  value: string,
  level: 1 | 2 | 3 = 2,
  section: string | null = null,
): Block => ({ type: 'heading', attrs: { level, section }, content: [text(value)] }) as Block
export const figure = (figureId: string, caption: string): Block => ({
  type: 'figure',
  attrs: { figureId, photoId: 1, caption },
})

/** An issued revision's input with every kind of node, the symbols and an amendment. */
export async function sampleReportInput(
  overrides: Partial<ReportPdfInput> = {},
): Promise<ReportPdfInput> {
  const doc: FindingsDocument = {
    type: 'doc',
    content: [
      heading('Summary', 2, 'summary'),
      paragraph(
        'The pin failed by fatigue from the thread root (see ',
        { type: 'figureRef', attrs: { figureId: 'f-origin' } },
        '). Stresses σ ≤ 350 MPa, strain ε ≥ 0.2 %, E = 205 ± 4 GPa, grain 25 µm at 20 °C, √2.',
      ),
      heading('Examinations', 2, 'examinations'),
      figure('f-overview', 'General view of the pin as received'),
      {
        type: 'bulletList',
        content: [
          { type: 'listItem', content: [paragraph('Beach marks over 70 % of the section')] },
          {
            type: 'listItem',
            content: [
              paragraph(
                { type: 'text', text: 'Ratchet marks', marks: [{ type: 'bold' }] },
                ' at the root',
              ),
            ],
          },
        ],
      },
      figure('f-origin', 'Origin at the thread root, marked'),
      {
        type: 'table',
        content: [
          {
            type: 'tableRow',
            content: [
              {
                type: 'tableHeader',
                attrs: { colspan: 2, rowspan: 1 },
                content: [paragraph('Hardness HV10')],
              },
              {
                type: 'tableHeader',
                attrs: { colspan: 1, rowspan: 1 },
                content: [paragraph('Place')],
              },
            ],
          },
          {
            type: 'tableRow',
            content: [
              {
                type: 'tableCell',
                attrs: { colspan: 1, rowspan: 2 },
                content: [paragraph('Core')],
              },
              { type: 'tableCell', attrs: { colspan: 1, rowspan: 1 }, content: [paragraph('287')] },
              {
                type: 'tableCell',
                attrs: { colspan: 1, rowspan: 1 },
                content: [paragraph('mid-radius')],
              },
            ],
          },
          {
            type: 'tableRow',
            content: [
              { type: 'tableCell', attrs: { colspan: 1, rowspan: 1 }, content: [paragraph('291')] },
              {
                type: 'tableCell',
                attrs: { colspan: 1, rowspan: 1 },
                content: [paragraph('centre')],
              },
            ],
          },
        ],
      },
      heading('Mechanical testing', 2, 'mechanical'),
      { type: 'liveBlock', attrs: { kind: 'tensile_results' } },
      heading('Discussion', 2, 'discussion'),
      {
        type: 'opinion',
        attrs: { observations: [1, 2], assumptions: 'Loads as stated by the operator' },
        content: [paragraph('The crack grew by fatigue under bending.')],
      },
      heading('Conclusions', 2, 'conclusions'),
      {
        type: 'orderedList',
        attrs: { start: 1 },
        content: [{ type: 'listItem', content: [paragraph('Fatigue from the thread root.')] }],
      },
    ],
  }
  return {
    laboratory: {
      name: 'Kestrelmoor Materials Laboratory',
      addressLines: ['4 Foundry Row', 'Kestrelmoor KM2 7QT'],
    },
    report: {
      number: 'FL-2026-0007-R',
      revision: 'B',
      issuedAt: '2026-11-30T10:00:00.000Z',
      replaces: { revision: 'A', reason: 'Hardness of the core corrected' },
      draft: false,
    },
    case: {
      number: 'FL-2026-0007',
      title: 'Fractured crane hook pin',
      clientName: 'Tallowmere Cranes Ltd',
      clientReference: 'TC-PO-4471',
      component: 'Hook pin, 60 mm',
      material: '42CrMo4 +QT (EN 10083-3)',
    },
    dates: {
      itemsReceived: '2026-10-02',
      testsFrom: '2026-10-05',
      testsTo: '2026-10-19',
      issued: '2026-11-30',
    },
    people: {
      author: { name: 'Tomas Reyke', role: 'Investigator' },
      reviewer: { name: 'Maren Ashdown', role: 'Reviewer' },
      authoriser: { name: 'Ines Haldane', role: 'Laboratory manager' },
    },
    doc,
    figures: { 'f-overview': { png: await figurePng(1) }, 'f-origin': { png: await figurePng(2) } },
    liveBlocks: {
      tensile_results: {
        kind: 'tensile_results',
        title: 'Tensile results and conformity',
        columns: ['Specimen', 'Standard', 'E', 'Yield', 'Rm', 'A', 'Z', 'Specification'],
        rows: [
          ['T1', 'ISO 6892-1', '206 GPa', 'Rp0.2 742 MPa', '905 MPa', '14.5 %', '52 %', 'meets'],
        ],
        notes: ['Judged against EN 10083-3 42CrMo4 (EN 10083-3, edition 2006).'],
        takenAt: '2026-11-29T09:00:00.000Z',
      },
    },
    observations: [
      { number: 1, text: 'Beach marks on the fracture face', withdrawn: false },
      { number: 2, text: 'Ratchet marks at the thread root', withdrawn: false },
      { number: 3, text: 'Rust on the shank', withdrawn: true },
    ],
    conformity: [
      'Specification: EN 10083-3 42CrMo4 +QT, edition 2006.',
      'Decision rule: simple acceptance; expanded uncertainty U (k = 2) of Rm ± 9 MPa reported beside each value.',
      'Indicative only: specimens cut from a failed part are not the product’s test pieces.',
    ],
    ...overrides,
  }
}
