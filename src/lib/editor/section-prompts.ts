// Each empty section shows its prompt as a placeholder: a decoration drawn by CSS (`.section-prompt::before`),
// never part of the document, so it can neither be saved nor pass its formatting on to what is typed over it.
//
// Tiptap's Placeholder extension is not used: its callback sees only the empty node and its position, and with
// every empty node decorated (not only the one holding the cursor) it runs while `editor.state` is still the
// document before the change, so it cannot reliably tell which heading the paragraph follows. Reading the state
// ProseMirror hands to `decorations` is always current.
import { Extension } from '@tiptap/core';
import type { Node as PmNode } from '@tiptap/pm/model';
import { Plugin, PluginKey } from '@tiptap/pm/state';
import { Decoration, DecorationSet } from '@tiptap/pm/view';
import { sectionPrompt } from './templates';

export const SectionPrompts = Extension.create({
  name: 'sectionPrompts',
  addProseMirrorPlugins() {
    return [
      new Plugin({
        key: new PluginKey('sectionPrompts'),
        props: {
          decorations(state) {
            const found: Decoration[] = [];
            let previous: PmNode | null = null;
            state.doc.forEach((node, offset) => {
              const prompt =
                node.type.name === 'paragraph' && node.content.size === 0 && previous
                  ? sectionPrompt({ type: previous.type.name, text: previous.textContent })
                  : null;
              if (prompt)
                found.push(
                  Decoration.node(offset, offset + node.nodeSize, { class: 'section-prompt', 'data-prompt': prompt }),
                );
              previous = node;
            });
            return DecorationSet.create(state.doc, found);
          },
        },
      }),
    ];
  },
});
