import type { Editor } from '@tiptap/core'
import { TextSelection } from '@tiptap/pm/state'

/**
 * Inserts a figure or live block at the cursor and puts the cursor in an empty paragraph after
 * it, so the writer types on below it rather than over it (an inserted atom is left selected).
 */
export function insertBlockAtom(editor: Editor, content: object): boolean {
  return editor
    .chain()
    .focus()
    .insertContent(content)
    .command(({ tr, state }) => {
      const after = tr.selection.to
      const next = tr.doc.resolve(after).nodeAfter
      if (!(next?.type.name === 'paragraph' && next.content.size === 0))
        tr.insert(after, state.schema.nodes.paragraph!.create())
      tr.setSelection(TextSelection.create(tr.doc, after + 1))
      return true
    })
    .scrollIntoView()
    .run()
}
