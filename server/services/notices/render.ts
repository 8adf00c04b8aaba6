import type { StoredNotice } from './notice-kinds'
import { TEMPLATES } from './templates'

export interface RenderedNotice {
  subject: string
  text: string
  html: string
}

const SUBJECT_LIMIT = 400

/**
 * One line of at most `limit` characters: line breaks and other control characters become
 * spaces, so a name or title can never start a header of its own.
 */
export function oneLine(value: string, limit = SUBJECT_LIMIT): string {
  const flat = value.replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, ' ').trim()
  return flat.length <= limit ? flat : `${flat.slice(0, limit - 1)}…`
}

const ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
}
const escapeHtml = (value: string) => value.replace(/[&<>"']/g, (char) => ESCAPES[char] ?? char)

const quoteText = (quote: string) =>
  quote
    .split(/\r?\n/)
    .map((line) => `> ${line}`)
    .join('\n')

/** The message in plain text and HTML, with its link built from `publicUrl`. */
export function renderNotice(stored: StoredNotice, publicUrl: string): RenderedNotice {
  const content = TEMPLATES[stored.kind](stored.facts)
  const link = `${publicUrl.replace(/\/+$/, '')}${content.linkPath}`
  const greeting = `Hello ${oneLine(stored.facts.recipientName, 191)},`
  const closing = 'This message was sent by Fractolog.'
  const text = [
    greeting,
    ...content.paragraphs,
    ...(content.quote ? [quoteText(content.quote)] : []),
    `${content.linkLabel}: ${link}`,
    closing,
  ].join('\n\n')
  const html = [
    '<!doctype html><html><body style="font-family: sans-serif; line-height: 1.5">',
    `<p>${escapeHtml(greeting)}</p>`,
    ...content.paragraphs.map((paragraph) => `<p>${escapeHtml(paragraph)}</p>`),
    ...(content.quote
      ? [`<blockquote style="white-space: pre-wrap">${escapeHtml(content.quote)}</blockquote>`]
      : []),
    `<p><a href="${escapeHtml(link)}">${escapeHtml(content.linkLabel)}</a></p>`,
    `<p style="color: #666">${escapeHtml(closing)}</p>`,
    '</body></html>',
  ].join('\n')
  return { subject: oneLine(content.subject), text: `${text}\n`, html }
}
