// Turns a stored editor document (ProseMirror/Tiptap JSON) back into Markdown for the handover bundle, so a
// record reads well in any text editor or Markdown viewer. Covers every node and mark the record editor makes.
import type { JSONContent } from '@tiptap/core';

type Mark = NonNullable<JSONContent['marks']>[number];

export interface MarkdownOptions {
  /** Rewrites link targets, e.g. the app's "/records/{id}" into a path inside the bundle. */
  href?: (href: string) => string;
  /** Rewrites an image's address, e.g. the app's "/api/attachments/{id}" into the attachment's file in the bundle. */
  src?: (src: string) => string;
}

// Set for the duration of one synchronous docToMarkdown call.
let options: MarkdownOptions = {};

export function docToMarkdown(doc: unknown, opts: MarkdownOptions = {}): string {
  if (!doc || typeof doc !== 'object') return '';
  options = opts;
  const out = blocks((doc as JSONContent).content ?? [], '');
  return out.replace(/\n{3,}/g, '\n\n').trim() + '\n';
}

/** Renders block nodes one after another, separated by blank lines, each line prefixed (for quotes and lists). */
function blocks(nodes: JSONContent[], prefix: string): string {
  return nodes
    .map((n) => block(n, prefix))
    .filter((s) => s !== null)
    .join(`\n${prefix.trimEnd()}\n`);
}

function prefixLines(text: string, first: string, rest: string): string {
  return text
    .split('\n')
    .map((line, i) => (i === 0 ? first : rest) + line)
    .map((line) => (line.trim() === '' ? line.trimEnd() : line))
    .join('\n');
}

function block(n: JSONContent, prefix: string): string | null {
  switch (n.type) {
    case 'paragraph':
      return prefixLines(inline(n.content ?? []), prefix, prefix);
    case 'heading': {
      const level = Math.min(6, Math.max(1, Number(n.attrs?.level ?? 2)));
      return prefix + '#'.repeat(level) + ' ' + inline(n.content ?? []).replace(/\n/g, ' ');
    }
    case 'blockquote':
      return blocks(n.content ?? [], prefix + '> ');
    case 'codeBlock': {
      const code = (n.content ?? []).map((c) => c.text ?? '').join('');
      const fence = code.includes('```') ? '~~~~' : '```';
      const lang = typeof n.attrs?.language === 'string' ? n.attrs.language : '';
      return prefixLines(`${fence}${lang}\n${code}\n${fence}`, prefix, prefix);
    }
    case 'horizontalRule':
      return prefix + '---';
    case 'image': {
      const given = typeof n.attrs?.src === 'string' ? n.attrs.src : '';
      const src = options.src ? options.src(given) : given;
      const alt = typeof n.attrs?.alt === 'string' ? n.attrs.alt : '';
      return prefix + `![${escapeText(alt.replace(/\s+/g, ' '))}](${src.replace(/[()\s]/g, encodeURIComponent)})`;
    }
    case 'bulletList':
    case 'orderedList':
    case 'taskList':
      return list(n, prefix);
    default:
      // Unknown nodes keep their text rather than vanish.
      return n.content ? blocks(n.content, prefix) : n.text ? prefix + escapeText(n.text) : null;
  }
}

function list(n: JSONContent, prefix: string): string {
  const start = Number(n.attrs?.start ?? 1) || 1;
  return (n.content ?? [])
    .map((item, i) => {
      let marker = '- ';
      if (n.type === 'orderedList') marker = `${start + i}. `;
      if (n.type === 'taskList') marker = item.attrs?.checked ? '- [x] ' : '- [ ] ';
      const indent = ' '.repeat(marker.length);
      // Items hold blocks; lay them out without the outer prefix, then indent continuation lines under the marker.
      const body = (item.content ?? []).map((c) => block(c, '') ?? '').join('\n\n') || '';
      return prefixLines(body, prefix + marker, prefix + indent);
    })
    .join('\n');
}

const ORDER = ['link', 'bold', 'italic', 'strike', 'code'];

function inline(nodes: JSONContent[]): string {
  let out = '';
  for (const n of nodes) {
    if (n.type === 'hardBreak') {
      out += '\\\n';
      continue;
    }
    if (typeof n.text !== 'string') continue;
    const marks = [...(n.marks ?? [])].sort((a, b) => ORDER.indexOf(a.type) - ORDER.indexOf(b.type));
    out += wrap(n.text, marks);
  }
  return out;
}

/** Applies marks inside-out, keeping spaces outside the markers (CommonMark ignores `** bold**`). */
function wrap(text: string, marks: Mark[]): string {
  const lead = /^\s*/.exec(text)![0];
  const trail = /\s*$/.exec(text.slice(lead.length))![0];
  const core = text.slice(lead.length, text.length - trail.length);
  if (!core) return text;
  const isCode = marks.some((m) => m.type === 'code');
  let s = isCode ? codeSpan(core) : escapeText(core);
  for (const m of [...marks].reverse()) {
    if (m.type === 'bold') s = `**${s}**`;
    else if (m.type === 'italic') s = `_${s}_`;
    else if (m.type === 'strike') s = `~~${s}~~`;
    else if (m.type === 'link' && typeof m.attrs?.href === 'string') {
      const href = options.href ? options.href(m.attrs.href) : m.attrs.href;
      s = `[${s}](${href.replace(/[()\s]/g, encodeURIComponent)})`;
    }
  }
  return lead + s + trail;
}

function codeSpan(text: string): string {
  const ticks = /`+/g.test(text) ? '``' : '`';
  const pad = text.startsWith('`') || text.endsWith('`') ? ' ' : '';
  return `${ticks}${pad}${text}${pad}${ticks}`;
}

/** Escapes what Markdown would read as syntax, so text comes back as the same text. */
export function escapeText(text: string): string {
  return text
    .replace(/([\\`*_[\]<>|~])/g, '\\$1')
    .replace(/^(\s*)([#+-])(?=\s)/gm, '$1\\$2')
    .replace(/^(\s*)(\d+)\.(?=\s)/gm, '$1$2\\.');
}
