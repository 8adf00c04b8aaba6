import { describe, expect, it } from 'vitest'
import { NOTICE_KINDS, type NoticeFacts } from '../../../server/services/notices/notice-kinds'
import { oneLine, renderNotice } from '../../../server/services/notices/render'

const facts: NoticeFacts = {
  caseId: 42,
  caseNumber: 'FL-2026-0042',
  caseTitle: 'Cracked <b>pump</b> shaft & "coupling"',
  recipientName: 'Ana\r\nBcc: someone@example.test',
  part: 'reviewer',
  reason: 'Line one\nline two <script>',
  reportNumber: 'R-2026-0007',
  askedByName: 'C. Client',
  question: 'When?',
  answer: 'Soon.',
  plannedWork: 'Section the origin',
  plannedOn: '2026-12-10',
  respondBy: '2026-12-08',
}

describe('notice templates', () => {
  for (const kind of NOTICE_KINDS) {
    it(`${kind}: subject led by the case or report number, link from PUBLIC_URL, HTML escaped`, () => {
      const mail = renderNotice({ kind, facts }, 'https://lab.example.test/fractolog/')
      const lead = kind === 'report_issued' ? 'R-2026-0007: ' : 'FL-2026-0042: '
      expect(mail.subject.startsWith(lead)).toBe(true)
      expect(mail.text).toMatch(
        /: https:\/\/lab\.example\.test\/fractolog\/cases\/42(\/[a-z/]+)?\n/,
      )
      expect(mail.html).toMatch(
        /href="https:\/\/lab\.example\.test\/fractolog\/cases\/42(\/[a-z/]+)?"/,
      )
      expect(mail.text.startsWith('Hello Ana Bcc: someone@example.test,\n')).toBe(true)
      expect(mail.html).not.toMatch(/<b>|<script>/)
      expect(mail.subject).not.toMatch(/[\r\n]/)
    })
  }

  it('quotes the reason of a request for revisions line by line', () => {
    const mail = renderNotice({ kind: 'revisions_requested', facts }, 'https://x.test')
    expect(mail.text).toContain('> Line one\n> line two <script>')
    expect(mail.html).toContain('Line one\nline two &lt;script&gt;')
  })
})

describe('oneLine', () => {
  it('turns line breaks and control characters into single spaces', () => {
    expect(oneLine('a\r\nb\tc\u0000d\u2028e')).toBe('a b c d e')
  })

  it('cuts at the limit with an ellipsis', () => {
    expect(oneLine('x'.repeat(500), 400)).toHaveLength(400)
    expect(oneLine('x'.repeat(500), 400).endsWith('…')).toBe(true)
  })
})
