// Turns the demo scenario's Markdown into the editor's document JSON (headings, paragraphs, lists, quotes,
// code, bold, italic, code spans and links), so seeded records are exactly what the editor would have saved.
import { marked, type Token, type Tokens } from 'marked';
import type { JSONContent } from '@tiptap/core';

type Mark = { type: string; attrs?: Record<string, unknown> };

function inline(tokens: Token[] | undefined, marks: Mark[] = []): JSONContent[] {
  const out: JSONContent[] = [];
  for (const t of tokens ?? []) {
    switch (t.type) {
      case 'text':
      case 'escape': {
        const tt = t as Tokens.Text;
        if (tt.tokens && tt.tokens.length) out.push(...inline(tt.tokens, marks));
        else if (tt.text) out.push({ type: 'text', text: decode(tt.text), ...(marks.length ? { marks } : {}) });
        break;
      }
      case 'strong':
        out.push(...inline((t as Tokens.Strong).tokens, [...marks, { type: 'bold' }]));
        break;
      case 'em':
        out.push(...inline((t as Tokens.Em).tokens, [...marks, { type: 'italic' }]));
        break;
      case 'del':
        out.push(...inline((t as Tokens.Del).tokens, [...marks, { type: 'strike' }]));
        break;
      case 'codespan':
        out.push({ type: 'text', text: decode((t as Tokens.Codespan).text), marks: [...marks, { type: 'code' }] });
        break;
      case 'link': {
        const l = t as Tokens.Link;
        out.push(...inline(l.tokens, [...marks, { type: 'link', attrs: { href: l.href } }]));
        break;
      }
      case 'br':
        out.push({ type: 'hardBreak' });
        break;
      default:
        if ('text' in t && typeof t.text === 'string' && t.text)
          out.push({ type: 'text', text: decode(t.text), ...(marks.length ? { marks } : {}) });
    }
  }
  return out;
}

function decode(s: string): string {
  return s
    .replace(/&amp;/g, '&')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'");
}

function paragraph(tokens: Token[] | undefined): JSONContent {
  const content = inline(tokens);
  return content.length ? { type: 'paragraph', content } : { type: 'paragraph' };
}

function blocks(tokens: Token[]): JSONContent[] {
  const out: JSONContent[] = [];
  for (const t of tokens) {
    switch (t.type) {
      case 'heading': {
        const h = t as Tokens.Heading;
        out.push({ type: 'heading', attrs: { level: Math.min(3, Math.max(2, h.depth)) }, content: inline(h.tokens) });
        break;
      }
      case 'paragraph':
        out.push(paragraph((t as Tokens.Paragraph).tokens));
        break;
      case 'text':
        out.push(paragraph((t as Tokens.Text).tokens ?? [t]));
        break;
      case 'blockquote':
        out.push({ type: 'blockquote', content: blocks((t as Tokens.Blockquote).tokens) });
        break;
      case 'code':
        out.push({ type: 'codeBlock', content: [{ type: 'text', text: (t as Tokens.Code).text }] });
        break;
      case 'hr':
        out.push({ type: 'horizontalRule' });
        break;
      case 'list': {
        const l = t as Tokens.List;
        const task = l.items.some((i) => i.task);
        out.push({
          type: task ? 'taskList' : l.ordered ? 'orderedList' : 'bulletList',
          content: l.items.map((item) => {
            const content = blocks(item.tokens.filter((x) => x.type !== 'checkbox'));
            return task
              ? {
                  type: 'taskItem',
                  attrs: { checked: !!item.checked },
                  content: content.length ? content : [{ type: 'paragraph' }],
                }
              : { type: 'listItem', content: content.length ? content : [{ type: 'paragraph' }] };
          }),
        });
        break;
      }
      default:
        break; // space, html (not allowed in records), tables (none in the demo)
    }
  }
  return out;
}

export function markdownToDoc(markdown: string): JSONContent {
  const content = blocks(marked.lexer(markdown, { gfm: true }));
  return { type: 'doc', content: content.length ? content : [{ type: 'paragraph' }] };
}
