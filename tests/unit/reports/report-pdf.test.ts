import sharp from 'sharp'
import { beforeAll, describe, expect, it } from 'vitest'
import { DRAFT_WATERMARK, renderReportPdf } from '../../../server/services/reports/pdf'
import { REPORT_CAUTIONS } from '../../../shared/reports/cautions'
import { sampleReportInput } from '../../factories/report-pdf-input'
import { pdfPagesAsPng } from '../../helpers/pdf-pages'
import { flat, pdfPageTexts } from '../../helpers/pdf-text'

let issued: Buffer
let pages: string[]
let whole: string
let draftPages: string[]

beforeAll(async () => {
  const input = await sampleReportInput()
  issued = await renderReportPdf(input)
  pages = await pdfPageTexts(issued)
  whole = flat(pages.join('\n'))
  const draft = await renderReportPdf({
    ...input,
    report: { ...input.report, revision: 'draft', issuedAt: null, replaces: null, draft: true },
  })
  draftPages = await pdfPageTexts(draft)
}, 60_000)

describe('the issued report as PDF', () => {
  it('is a PDF of several pages, each saying "Page x of y" with the real total', () => {
    expect(issued.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    expect(pages.length).toBeGreaterThanOrEqual(4)
    pages.forEach((text, index) => {
      expect(flat(text)).toContain(`Page ${index + 1} of ${pages.length}`)
    })
  })

  it('carries the report number and revision in the header of every page', () => {
    for (const text of pages) expect(flat(text)).toContain('Report FL-2026-0007-R · Revision B')
  })

  it('has a title page with the laboratory, client, component, dates and people (ISO/IEC 17025 §7.8.2.1)', () => {
    const title = flat(pages[0] as string)
    for (const field of [
      'Kestrelmoor Materials Laboratory',
      '4 Foundry Row',
      'Kestrelmoor KM2 7QT',
      'Fractured crane hook pin',
      'Client Tallowmere Cranes Ltd',
      'Client reference TC-PO-4471',
      'Component Hook pin, 60 mm',
      'Material as specified 42CrMo4 +QT (EN 10083-3)',
      'Items received 2026-10-02',
      'Examinations and tests performed 2026-10-05 to 2026-10-19',
      'Report issued 2026-11-30',
      'Author Tomas Reyke Investigator',
      'Reviewed by Maren Ashdown Reviewer',
      'Authorised for issue by Ines Haldane Laboratory manager',
    ])
      expect(title).toContain(field)
  })

  it('says on the title page which revision an amendment replaces and why', () => {
    expect(flat(pages[0] as string)).toContain(
      'This revision B replaces revision A. Reason for the amendment: Hardness of the core corrected',
    )
  })

  it('prints every section heading and numbers the figures in the order of the text', () => {
    for (const heading of [
      'Summary',
      'Examinations',
      'Mechanical testing',
      'Discussion',
      'Conclusions',
    ])
      expect(whole).toContain(heading)
    const first = whole.indexOf('Figure 1. General view of the pin as received')
    const second = whole.indexOf('Figure 2. Origin at the thread root, marked')
    expect(first).toBeGreaterThan(0)
    expect(second).toBeGreaterThan(first)
    // the cross-reference in the summary names the figure's number, not its id
    expect(whole).toContain('(see Figure 2)')
  })

  it('shows the frozen results table with its units and notes', () => {
    expect(whole).toContain('Tensile results and conformity')
    expect(whole).toContain('T1 ISO 6892-1 206 GPa Rp0.2 742 MPa 905 MPa 14.5 % 52 % meets')
    expect(whole).toContain('Judged against EN 10083-3 42CrMo4 (EN 10083-3, edition 2006).')
  })

  it('keeps a table’s spanned cells in place', () => {
    expect(whole).toContain('Hardness HV10 Place Core 287 mid-radius 291 centre')
  })

  it('sets opinions apart, citing observations by number, beside the register of observations', () => {
    expect(whole).toContain('Opinion, based on O-1, O-2 The crack grew by fatigue under bending.')
    expect(whole).toContain('Assumptions: Loads as stated by the operator')
    expect(whole).toContain('Register of observations')
    expect(whole).toContain('O-1 Beach marks on the fracture face Recorded')
    expect(whole).toContain('O-3 Rust on the shank Withdrawn')
  })

  it('states conformity with its specification, edition, decision rule, uncertainty and caution', () => {
    expect(whole).toContain('Conformity statement')
    expect(whole).toContain('Specification: EN 10083-3 42CrMo4 +QT, edition 2006.')
    expect(whole).toContain('Decision rule: simple acceptance; expanded uncertainty U (k = 2)')
    expect(whole).toContain(
      'Indicative only: specimens cut from a failed part are not the product’s test pieces.',
    )
  })

  it('closes with the cautions and the sign-off', () => {
    for (const caution of REPORT_CAUTIONS) expect(whole).toContain(caution)
    expect(whole).toContain(
      'Authorised for issue by Ines Haldane, Laboratory manager, on 2026-11-30.',
    )
    expect(whole).not.toContain(DRAFT_WATERMARK)
  })

  it('prints σ, ε, ≤, ≥, ±, µ, ° and √ as themselves, from embedded fonts', () => {
    expect(whole).toContain(
      'Stresses σ ≤ 350 MPa, strain ε ≥ 0.2 %, E = 205 ± 4 GPa, grain 25 \u00b5m at 20 °C, √2.',
    )
    const names = issued.toString('latin1')
    expect(names).toMatch(/\/FontName \/[A-Z]{6}\+MerriweatherSans-Regular/)
    expect(names).toMatch(/\/FontName \/[A-Z]{6}\+DejaVuSans/)
  })

  it('draws the figures: a figure page is not blank', async () => {
    const [, figurePage] = await pdfPagesAsPng(issued, 'issued-report', 3)
    const stats = await sharp(figurePage as string).stats()
    // a white page has a deviation of about 0; the figure's dark field and bright face spread it
    expect(Math.max(...stats.channels.map((channel) => channel.stdev))).toBeGreaterThan(40)
    const { dominant } = stats
    expect(dominant.r + dominant.g + dominant.b).toBeLessThan(3 * 250)
  })
})

describe('the draft preview as PDF', () => {
  it('is watermarked "Draft — not issued" on every page and says it is not issued', () => {
    for (const text of draftPages) {
      expect(flat(text)).toContain(DRAFT_WATERMARK)
      expect(flat(text)).toContain('Report FL-2026-0007-R · draft, not issued')
    }
    const all = flat(draftPages.join('\n'))
    expect(all).toContain('Not issued: this draft preview carries no authorisation.')
    expect(all).not.toContain('replaces revision')
  })
})
