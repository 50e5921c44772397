import { getSchema, type JSONContent } from '@tiptap/core';
import { generateHTML } from '@tiptap/html/server';
import { recordExtensions } from '../../editor/extensions';
import { isSafeHref } from '../../editor/links';
import { invalidInput } from '../http';

const extensions = recordExtensions();
const schema = getSchema(extensions);

export const MAX_BODY_CHARS = 400_000;
const MAX_DEPTH = 40;

export interface ProcessedBody {
  doc: JSONContent;
  html: string;
  text: string;
}

/**
 * Validates a ProseMirror document against the editor's own schema, drops unsafe links, and renders the HTML and
 * plain text the app shows and searches. Client HTML is never accepted; this HTML comes from the validated tree.
 */
export function processBody(input: unknown): ProcessedBody {
  const fail = (message: string) => invalidInput([{ path: 'body', message }], 'The record text could not be read.');
  if (!input || typeof input !== 'object' || Array.isArray(input)) throw fail('The body must be an editor document.');
  if (JSON.stringify(input).length > MAX_BODY_CHARS)
    throw fail(`The text is too long (over ${MAX_BODY_CHARS / 1000}k characters of document).`);
  const cleaned = clean(input as JSONContent, 0);
  if (cleaned === 'too-deep') throw fail('The document is nested too deeply.');
  if (cleaned === 'bad-attrs') throw fail('Headings may be level 2 or 3.');
  if (cleaned.type !== 'doc') throw fail('The body must be a document (type "doc").');
  let node;
  try {
    node = schema.nodeFromJSON(cleaned);
    node.check();
  } catch (e) {
    throw fail(
      `The document does not fit the editor's structure: ${e instanceof Error ? e.message.slice(0, 200) : 'invalid'}.`,
    );
  }
  const doc = node.toJSON() as JSONContent;
  return { doc, html: generateHTML(doc, extensions), text: node.textBetween(0, node.content.size, '\n', ' ').trim() };
}

/** Copies only the known shape of a node, dropping link marks whose target is not http(s) or mailto. */
function clean(n: JSONContent, depth: number): JSONContent | 'too-deep' | 'bad-attrs' {
  if (depth > MAX_DEPTH) return 'too-deep';
  const out: JSONContent = { type: String(n.type ?? '') };
  if (n.attrs && typeof n.attrs === 'object' && !Array.isArray(n.attrs)) out.attrs = { ...n.attrs };
  // The schema checks node types but not attribute values; the editor offers only these heading levels.
  if (out.type === 'heading' && ![2, 3].includes(Number(out.attrs?.level))) return 'bad-attrs';
  if (typeof n.text === 'string') out.text = n.text;
  if (Array.isArray(n.marks)) {
    out.marks = n.marks
      .filter((m) => m && typeof m === 'object' && typeof m.type === 'string')
      .filter((m) => m.type !== 'link' || isSafeHref(m.attrs?.href))
      .map((m) => ({ type: m.type, ...(m.attrs && typeof m.attrs === 'object' ? { attrs: { ...m.attrs } } : {}) }));
  }
  if (Array.isArray(n.content)) {
    const kids: JSONContent[] = [];
    for (const child of n.content) {
      if (!child || typeof child !== 'object') continue;
      const c = clean(child, depth + 1);
      if (c === 'too-deep' || c === 'bad-attrs') return c;
      kids.push(c);
    }
    out.content = kids;
  }
  return out;
}
