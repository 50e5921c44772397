import { useEditorState, type Editor } from '@tiptap/react';
import { isSafeHref } from '~/lib/editor/links';

interface Button {
  label: string;
  text: string;
  active?: (e: Editor) => boolean;
  run: (e: Editor) => void;
  shortcut?: string;
}

const BUTTONS: Button[][] = [
  [
    {
      label: 'Section heading',
      text: 'H2',
      active: (e) => e.isActive('heading', { level: 2 }),
      run: (e) => e.chain().focus().toggleHeading({ level: 2 }).run(),
    },
    {
      label: 'Sub-heading',
      text: 'H3',
      active: (e) => e.isActive('heading', { level: 3 }),
      run: (e) => e.chain().focus().toggleHeading({ level: 3 }).run(),
    },
  ],
  [
    {
      label: 'Bold',
      text: 'B',
      shortcut: 'Ctrl+B',
      active: (e) => e.isActive('bold'),
      run: (e) => e.chain().focus().toggleBold().run(),
    },
    {
      label: 'Italic',
      text: 'I',
      shortcut: 'Ctrl+I',
      active: (e) => e.isActive('italic'),
      run: (e) => e.chain().focus().toggleItalic().run(),
    },
    { label: 'Code', text: '</>', active: (e) => e.isActive('code'), run: (e) => e.chain().focus().toggleCode().run() },
    {
      label: 'Link',
      text: 'Link',
      active: (e) => e.isActive('link'),
      run: (e) => {
        const previous = (e.getAttributes('link').href as string | undefined) ?? 'https://';
        const href = window.prompt(
          'Link address (https://…, mailto:… or /records/…). Leave empty to remove the link.',
          previous,
        );
        if (href === null) return;
        if (href.trim() === '') e.chain().focus().extendMarkRange('link').unsetLink().run();
        else if (isSafeHref(href)) e.chain().focus().extendMarkRange('link').setLink({ href: href.trim() }).run();
        else window.alert('Only web (http/https), e-mail (mailto:) and Wakebook (/…) links are kept.');
      },
    },
  ],
  [
    {
      label: 'Bulleted list',
      text: '• List',
      active: (e) => e.isActive('bulletList'),
      run: (e) => e.chain().focus().toggleBulletList().run(),
    },
    {
      label: 'Numbered list',
      text: '1. List',
      active: (e) => e.isActive('orderedList'),
      run: (e) => e.chain().focus().toggleOrderedList().run(),
    },
    {
      label: 'Checklist',
      text: '☐ Tasks',
      active: (e) => e.isActive('taskList'),
      run: (e) => e.chain().focus().toggleTaskList().run(),
    },
    {
      label: 'Quote or caution',
      text: '❝',
      active: (e) => e.isActive('blockquote'),
      run: (e) => e.chain().focus().toggleBlockquote().run(),
    },
  ],
  [
    { label: 'Undo', text: '↶', shortcut: 'Ctrl+Z', run: (e) => e.chain().focus().undo().run() },
    { label: 'Redo', text: '↷', shortcut: 'Ctrl+Shift+Z', run: (e) => e.chain().focus().redo().run() },
  ],
];

export default function Toolbar({ editor }: { editor: Editor }) {
  // Re-render when the selection's formatting changes, so the pressed state stays true.
  const state = useEditorState({
    editor,
    selector: ({ editor: e }) => BUTTONS.flat().map((b) => (b.active ? b.active(e) : false)),
  });
  let i = 0;
  return (
    <div
      role="toolbar"
      aria-label="Formatting"
      className="sticky top-0 z-10 flex flex-wrap gap-1 border-b border-line bg-surface p-1.5"
    >
      {BUTTONS.map((group, g) => (
        <div key={g} className="flex gap-1 border-r border-line pr-1 last:border-0">
          {group.map((b) => {
            const pressed = b.active ? state[i] : undefined;
            i++;
            return (
              <button
                key={b.label}
                type="button"
                className="btn btn-quiet px-2 py-1 text-sm"
                aria-label={b.label}
                title={b.shortcut ? `${b.label} (${b.shortcut})` : b.label}
                aria-pressed={pressed}
                onMouseDown={(ev) => ev.preventDefault()}
                onClick={() => b.run(editor)}
                style={pressed ? { background: 'var(--wb-accent-soft)' } : undefined}
              >
                {b.text}
              </button>
            );
          })}
        </div>
      ))}
    </div>
  );
}
