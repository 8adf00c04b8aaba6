import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeCase, makeOrganisation, makePerson } from '../factories'
import { uploadPhoto } from '../factories/photos'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { appWithUploads } from '../helpers/app-with-uploads'
import { createTestDb, resetDatabase } from '../helpers/test-db'

/*
 * A corpus of hostile drafts. Ideas come from the OWASP Cross Site Scripting Prevention and XSS
 * Filter Evasion cheat sheets (event handlers, javascript:/vbscript:/data: URLs with case, space
 * and tab tricks, SVG and style vectors, attribute break-outs), the PortSwigger XSS cheat sheet
 * (SVG animate, protocol-relative URLs), the OWASP Prototype Pollution Prevention cheat sheet
 * (__proto__ and constructor.prototype keys) and Unicode Technical Report #36 with the "Trojan
 * Source" bidirectional override (CVE-2021-42574) and full-width look-alikes. Each payload is
 * either refused (422 invalid_document, 413, 400) or stored and rendered inert.
 */

const db = createTestDb()
const { app, cleanup } = appWithUploads(db)

let lead: ApiSession
let caseId: number
let photoId: number
let foreignPhotoId: number

beforeAll(async () => {
  await resetDatabase(db)
  const org = await makeOrganisation(db)
  const admin = await makePerson(db, ['admin'])
  const person = await makePerson(db, ['investigator'])
  lead = await signedIn(app, person.email, person.password)
  caseId = (await makeCase(db, org, admin.id, { leadInvestigatorId: person.id })).id
  const otherCase = (await makeCase(db, org, admin.id, { leadInvestigatorId: person.id })).id
  await db('cases').whereIn('id', [caseId, otherCase]).update({ status: 'drafting' })
  photoId = await uploadPhoto(lead, caseId, undefined, 'face.jpg')
  foreignPhotoId = await uploadPhoto(lead, otherCase, undefined, 'face.jpg')
  await lead.post(`/api/cases/${caseId}/observations`, { text: 'Beach marks' }).expect(201)
})
afterAll(async () => {
  await db.destroy()
  cleanup()
})

type Json = Record<string, unknown>
const text = (value: string, marks?: Json[]) => ({ type: 'text', text: value, marks })
const para = (...content: Json[]) => ({ type: 'paragraph', content })
const doc = (...content: Json[]) => ({ type: 'doc', content })
const linked = (href: string) => doc(para(text('click', [{ type: 'link', attrs: { href } }])))
const figure = (attrs: Json) => doc({ type: 'figure', attrs })
const nestedList = (depth: number): Json =>
  depth === 0
    ? para(text('deep'))
    : {
        type: 'bulletList',
        content: [{ type: 'listItem', content: [para(text('x')), nestedList(depth - 1)] }],
      }

interface Payload {
  name: string
  doc: unknown
  /** `inert`: stored, and nothing in it becomes markup; `refused`: nothing stored */
  outcome: 'inert' | 'refused'
}

const PAYLOADS = (): Payload[] => [
  // markup written as text is text
  {
    name: 'script tag as text',
    doc: doc(para(text('<script>alert(1)</script>'))),
    outcome: 'inert',
  },
  {
    name: 'img onerror as text',
    doc: doc(para(text('<img src=x onerror=alert(1)>'))),
    outcome: 'inert',
  },
  {
    name: 'attribute break-out as text',
    doc: doc(para(text('"><svg/onload=alert(1)>'))),
    outcome: 'inert',
  },
  {
    name: 'closing tags as text',
    doc: doc(para(text('</p></section><script>x</script>'))),
    outcome: 'inert',
  },
  {
    name: 'SVG animate as text',
    doc: doc(para(text('<svg><animate onbegin=alert(1) attributeName=x dur=1s>'))),
    outcome: 'inert',
  },
  {
    name: 'style url() as text',
    doc: doc(para(text('<div style="background:url(javascript:alert(1))">'))),
    outcome: 'inert',
  },
  {
    name: 'NUL before a tag',
    doc: doc(para(text('\u0000<script>alert(1)</script>'))),
    outcome: 'inert',
  },
  {
    name: 'bidi override and zero-width characters',
    doc: doc(para(text('safe\u202e>tpircs/<\u200d'))),
    outcome: 'inert',
  },
  // elements and marks the editor does not make
  { name: 'script node', doc: doc({ type: 'script', content: [] }), outcome: 'refused' },
  {
    name: 'iframe node',
    doc: doc({ type: 'iframe', attrs: { src: 'https://evil.example' } }),
    outcome: 'refused',
  },
  {
    name: 'svg node',
    doc: doc({ type: 'svg', attrs: { onload: 'alert(1)' } }),
    outcome: 'refused',
  },
  {
    name: 'foreign image node',
    doc: doc({ type: 'image', attrs: { src: 'https://evil.example/x.png' } }),
    outcome: 'refused',
  },
  {
    name: 'data: image node',
    doc: doc({ type: 'image', attrs: { src: 'data:image/svg+xml;base64,PHN2Zz4=' } }),
    outcome: 'refused',
  },
  {
    name: 'raw html node',
    doc: doc({ type: 'html', content: '<b onmouseover=alert(1)>' }),
    outcome: 'refused',
  },
  {
    name: 'style mark',
    doc: doc(para(text('x', [{ type: 'style', attrs: { css: 'x' } }]))),
    outcome: 'refused',
  },
  {
    name: 'text style colour mark',
    doc: doc(para(text('x', [{ type: 'textStyle', attrs: { color: 'red;background:url(x)' } }]))),
    outcome: 'refused',
  },
  {
    name: 'nine nested marks',
    doc: doc(
      para(
        text(
          'x',
          Array.from({ length: 9 }, () => ({ type: 'bold' })),
        ),
      ),
    ),
    outcome: 'refused',
  },
  { name: 'node type __proto__', doc: doc({ type: '__proto__' }), outcome: 'refused' },
  // link targets
  { name: 'javascript: link', doc: linked('javascript:alert(1)'), outcome: 'refused' },
  { name: 'mixed-case javascript: link', doc: linked('JaVaScRiPt:alert(1)'), outcome: 'refused' },
  {
    name: 'leading-space javascript: link',
    doc: linked(' javascript:alert(1)'),
    outcome: 'refused',
  },
  { name: 'tab inside javascript: link', doc: linked('java\tscript:alert(1)'), outcome: 'refused' },
  {
    name: 'entity-encoded javascript: link',
    doc: linked('&#106;avascript:alert(1)'),
    outcome: 'refused',
  },
  {
    name: 'full-width javascript: link',
    doc: linked('ｊａｖａｓｃｒｉｐｔ:alert(1)'),
    outcome: 'refused',
  },
  { name: 'vbscript: link', doc: linked('vbscript:msgbox(1)'), outcome: 'refused' },
  {
    name: 'data: link',
    doc: linked('data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg=='),
    outcome: 'refused',
  },
  { name: 'protocol-relative link', doc: linked('//evil.example/x'), outcome: 'refused' },
  {
    name: 'link breaking out of its quotes',
    doc: linked('https://example.org/" onmouseover="alert(1)'),
    outcome: 'refused',
  },
  {
    name: 'link with a tag in its query',
    doc: linked('https://example.org/?q=<script>'),
    outcome: 'refused',
  },
  {
    name: 'mailto with a tag',
    doc: linked('mailto:a@b.example?subject=<svg onload=x>'),
    outcome: 'refused',
  },
  {
    name: 'safe link with handler, style and target attributes',
    doc: doc(
      para(
        text('x', [
          {
            type: 'link',
            attrs: {
              href: 'https://example.org/',
              onclick: 'alert(1)',
              style: 'x',
              target: '_top',
            },
          },
        ]),
      ),
    ),
    outcome: 'inert',
  },
  // attributes
  {
    name: 'paragraph with style, class and handler attributes',
    doc: doc({
      type: 'paragraph',
      attrs: { style: 'width: expression(alert(1))', class: 'x', onclick: 'alert(1)' },
      content: [text('x')],
    }),
    outcome: 'inert',
  },
  {
    name: 'heading level as a handler',
    doc: doc({ type: 'heading', attrs: { level: '2 onclick=alert(1)' } }),
    outcome: 'refused',
  },
  {
    name: 'heading level given only through __proto__',
    doc: JSON.parse(
      '{"type":"doc","content":[{"type":"heading","attrs":{"__proto__":{"level":2}}}]}',
    ),
    outcome: 'refused',
  },
  {
    name: 'heading section breaking out',
    doc: doc({ type: 'heading', attrs: { level: 2, section: '"><script>' } }),
    outcome: 'refused',
  },
  {
    name: 'ordered list start as text',
    doc: doc({
      type: 'orderedList',
      attrs: { start: '1" onmouseover="x' },
      content: [{ type: 'listItem', content: [para(text('x'))] }],
    }),
    outcome: 'refused',
  },
  {
    name: 'table cell colspan as a handler',
    doc: doc({
      type: 'table',
      content: [
        {
          type: 'tableRow',
          content: [
            { type: 'tableCell', attrs: { colspan: '2" onclick="x' }, content: [para(text('x'))] },
          ],
        },
      ],
    }),
    outcome: 'refused',
  },
  {
    name: 'live block of an unknown kind',
    doc: doc({ type: 'liveBlock', attrs: { kind: '<script>' } }),
    outcome: 'refused',
  },
  {
    name: 'opinion citing a handler',
    doc: doc({
      type: 'opinion',
      attrs: { observations: ['1) alert(1'] },
      content: [para(text('x'))],
    }),
    outcome: 'refused',
  },
  {
    name: 'opinion assumptions with a style tag',
    doc: doc({
      type: 'opinion',
      attrs: { observations: [1], assumptions: '<style>*{display:none}</style>' },
      content: [para(text('x'))],
    }),
    outcome: 'inert',
  },
  // figures: only this case's photos, through the server's own figure export
  {
    name: 'figure with a foreign src beside its photo',
    doc: figure({ figureId: 'f1', photoId, caption: 'x', src: 'https://evil.example/x.png' }),
    outcome: 'inert',
  },
  {
    name: 'figure with a data: src beside its photo',
    doc: figure({
      figureId: 'f1',
      photoId,
      caption: 'x',
      src: 'data:image/svg+xml,<svg onload=alert(1)>',
    }),
    outcome: 'inert',
  },
  {
    name: 'figure caption breaking out of alt',
    doc: figure({ figureId: 'f1', photoId, caption: '"><img src=x onerror=alert(1)>' }),
    outcome: 'inert',
  },
  {
    name: 'figure of another case’s photo',
    doc: figure({ figureId: 'f1', photoId: foreignPhotoId, caption: 'x' }),
    outcome: 'refused',
  },
  {
    name: 'figure photo id as text',
    doc: figure({ figureId: 'f1', photoId: `${photoId} onerror=alert(1)`, caption: 'x' }),
    outcome: 'refused',
  },
  {
    name: 'figure id breaking out',
    doc: figure({ figureId: '"><script>', photoId, caption: 'x' }),
    outcome: 'refused',
  },
  {
    name: 'figure reference id breaking out',
    doc: doc(para({ type: 'figureRef', attrs: { figureId: 'x" onclick="y' } })),
    outcome: 'refused',
  },
  // pollution and size
  {
    name: 'constructor.prototype in attributes',
    doc: JSON.parse(
      '{"type":"doc","content":[{"type":"paragraph","attrs":{"constructor":{"prototype":{"polluted":true}}},"content":[{"type":"text","text":"x"}]}],"__proto__":{"polluted":true}}',
    ),
    outcome: 'inert',
  },
  { name: 'lists nested deeper than the limit', doc: doc(nestedList(12)), outcome: 'refused' },
  {
    name: 'more elements than the limit',
    doc: doc(para(...Array.from({ length: 50_001 }, () => ({ type: 'hardBreak' })))),
    outcome: 'refused',
  },
  {
    name: 'a document over 2 MB',
    doc: doc(...Array.from({ length: 25 }, () => para(text('<'.repeat(99_000))))),
    outcome: 'refused',
  },
]

const ALLOWED_TAGS = new Set(
  'p h1 h2 h3 h4 strong em sub sup a br ul ol li table thead tbody tr th td figure img figcaption section aside'.split(
    ' ',
  ),
)
const ALLOWED_ATTRIBUTES = new Set(
  'href rel class id src alt colspan rowspan start data-kind'.split(' '),
)
const TAG = /<(\/?)([a-zA-Z0-9]+)((?:\s+[a-z-]+="[^"<>]*")*)\s*>/g
const ATTRIBUTE = /\s+([a-z-]+)="([^"<>]*)"/g

/** Every tag and attribute in the HTML is the renderer's own, and every URL one it may write. */
function problemsIn(html: string): string[] {
  const problems: string[] = []
  const outside = html.replace(TAG, (_match, _close: string, tag: string, attributes: string) => {
    if (!ALLOWED_TAGS.has(tag.toLowerCase())) problems.push(`tag <${tag}>`)
    for (const [, name, value] of attributes.matchAll(ATTRIBUTE)) {
      if (!ALLOWED_ATTRIBUTES.has(name!)) problems.push(`attribute ${name}`)
      if (name === 'href' && !/^(https?:\/\/|mailto:|#figure-)/.test(value!))
        problems.push(`href ${value}`)
      if (name === 'src' && !/^\/api\/photos\/\d+\/figure$/.test(value!))
        problems.push(`src ${value}`)
    }
    return ''
  })
  // outside the tags, only escaped text: a stray < or > would be markup the scan did not read
  if (/[<>]/.test(outside)) problems.push('unescaped < or > in text')
  for (const [, , value] of html.matchAll(ATTRIBUTE))
    if (/^\s*(javascript|vbscript|data):/i.test(value!)) problems.push(`URL ${value}`)
  return problems
}

const DOCUMENT_KEYS = new Set(
  'type content text marks attrs level section start colspan rowspan figureId photoId caption kind observations assumptions href'.split(
    ' ',
  ),
)

/** Keys of the stored draft that the document contract does not name. */
function strangeKeys(value: unknown, found: string[] = []): string[] {
  if (Array.isArray(value)) value.forEach((item) => strangeKeys(item, found))
  else if (value && typeof value === 'object')
    for (const [key, inner] of Object.entries(value)) {
      // observation numbers and text are values, not keys
      if (!DOCUMENT_KEYS.has(key)) found.push(key)
      if (key !== 'text') strangeKeys(inner, found)
    }
  return found
}

const findings = () => `/api/cases/${caseId}/findings`

describe('hostile drafts', () => {
  it('holds at least 30 payloads', () => {
    expect(PAYLOADS().length).toBeGreaterThanOrEqual(30)
  })

  it('never lets a payload reach the rendered HTML as markup', async () => {
    for (const payload of PAYLOADS()) {
      const { version } = (await lead.get(findings()).expect(200)).body.data
      const response = await lead.agent
        .put(findings())
        .set('X-CSRF-Token', lead.token)
        .set('Content-Type', 'application/json')
        .send(JSON.stringify({ doc: payload.doc, version }))
      const after = (await lead.get(findings()).expect(200)).body.data
      if (payload.outcome === 'refused') {
        expect([400, 413, 422], payload.name).toContain(response.status)
        if (response.status === 422)
          expect(response.body.error.code, payload.name).toBe('invalid_document')
        expect(after.version, `${payload.name}: nothing stored`).toBe(version)
      } else {
        expect(response.status, `${payload.name}: ${JSON.stringify(response.body)}`).toBe(200)
        expect(problemsIn(response.body.data.html), payload.name).toEqual([])
      }
      expect(problemsIn(after.html), payload.name).toEqual([])
      expect(strangeKeys(after.doc), payload.name).toEqual([])
    }
    expect(({} as Record<string, unknown>).polluted).toBeUndefined()
    expect(Object.prototype).not.toHaveProperty('polluted')
  }, 120_000)

  it('finds markup in a rendering that is not the renderer’s own (the check can fail)', () => {
    expect(problemsIn('<p>ok</p>')).toEqual([])
    expect(problemsIn('<p onclick="x">a</p>')).toEqual(['attribute onclick'])
    expect(problemsIn('<a href="javascript:alert(1)">a</a>')).toEqual([
      'href javascript:alert(1)',
      'URL javascript:alert(1)',
    ])
    expect(problemsIn('<img src="https://evil.example/x.png" alt="">')).toEqual([
      'src https://evil.example/x.png',
    ])
    expect(problemsIn('<svg></svg>')).toEqual(['tag <svg>', 'tag <svg>'])
    expect(problemsIn('<p>a <b</p>')).toEqual(['unescaped < or > in text'])
  })
})
