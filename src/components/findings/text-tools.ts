import type { Editor } from '@tiptap/core'

export interface TextTool {
  key: string
  /** what the tooltip says, and a screen reader after the button's text */
  label: string
  /** what the button shows */
  text: string
  /** what a screen reader says instead of `label` */
  spoken?: string
  /** `tool-<key>` unless given */
  testId?: string
  active?: () => boolean
  run: () => void
}

export interface ToolGroup {
  name: string
  tools: TextTool[]
}

/** The symbols the trade writes, one click each. */
export const SYMBOLS = [
  { text: 'σ', name: 'sigma (stress)' },
  { text: 'ε', name: 'epsilon (strain)' },
  { text: 'µm', name: 'micrometre' },
  { text: '°C', name: 'degrees Celsius' },
  { text: '±', name: 'plus-minus' },
  { text: '≤', name: 'less than or equal' },
  { text: '≥', name: 'greater than or equal' },
] as const

/** The symbols as one group of buttons, each inserting its text where the cursor is. */
function symbolGroup(editor: Editor): ToolGroup {
  return {
    name: 'Symbols',
    tools: SYMBOLS.map((symbol) => ({
      key: symbol.name,
      label: symbol.name,
      text: symbol.text,
      spoken: `insert ${symbol.name}`,
      testId: `symbol-${symbol.name}`,
      run: () => editor.chain().focus().insertContent(symbol.text).run(),
    })),
  }
}

/**
 * The toolbar's formatting and symbol buttons, grouped; table tools appear while in a table,
 * before the symbols.
 */
export function textToolGroups(editor: Editor): ToolGroup[] {
  const chain = () => editor.chain().focus()
  const heading = (level: 2 | 3): TextTool => ({
    key: `heading-${level}`,
    label: `Heading level ${level}`,
    text: `H${level}`,
    active: () => editor.isActive('heading', { level }),
    run: () => chain().toggleHeading({ level }).run(),
  })
  const mark = (key: string, label: string, text: string, run: () => void): TextTool => ({
    key,
    label,
    text,
    active: () => editor.isActive(key),
    run,
  })
  const groups: ToolGroup[] = [
    {
      name: 'Paragraph style',
      tools: [
        {
          key: 'paragraph',
          label: 'Plain paragraph',
          text: '¶',
          active: () => editor.isActive('paragraph'),
          run: () => chain().setParagraph().run(),
        },
        heading(2),
        heading(3),
      ],
    },
    {
      name: 'Text',
      tools: [
        mark('bold', 'Bold', 'B', () => chain().toggleBold().run()),
        mark('italic', 'Italic', 'I', () => chain().toggleItalic().run()),
        mark('subscript', 'Subscript', 'x₂', () => chain().toggleSubscript().run()),
        mark('superscript', 'Superscript', 'x²', () => chain().toggleSuperscript().run()),
      ],
    },
    {
      name: 'Lists and tables',
      tools: [
        mark('bulletList', 'Bulleted list', '• List', () => chain().toggleBulletList().run()),
        mark('orderedList', 'Numbered list', '1. List', () => chain().toggleOrderedList().run()),
        {
          key: 'table',
          label: 'Insert a table of 3 × 3 with a header row',
          text: 'Table',
          run: () => chain().insertTable({ rows: 3, cols: 3, withHeaderRow: true }).run(),
        },
      ],
    },
  ]
  if (editor.isActive('table'))
    groups.push({
      name: 'Table',
      tools: [
        {
          key: 'row-after',
          label: 'Add a row below',
          text: '+ Row',
          run: () => chain().addRowAfter().run(),
        },
        {
          key: 'column-after',
          label: 'Add a column to the right',
          text: '+ Column',
          run: () => chain().addColumnAfter().run(),
        },
        {
          key: 'row-delete',
          label: 'Delete this row',
          text: '− Row',
          run: () => chain().deleteRow().run(),
        },
        {
          key: 'column-delete',
          label: 'Delete this column',
          text: '− Column',
          run: () => chain().deleteColumn().run(),
        },
        {
          key: 'table-delete',
          label: 'Delete the table',
          text: 'Delete table',
          run: () => chain().deleteTable().run(),
        },
      ],
    })
  groups.push(symbolGroup(editor))
  return groups
}
