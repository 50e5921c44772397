import { getSchema, type JSONContent } from '@tiptap/core';
import { generateHTML } from '@tiptap/html/server';
import { recordExtensions } from '../../editor/extensions';
import { isAttachmentSrc, isSafeHref } from '../../editor/links';
import { SECTION_PROMPTS } from '../../editor/templates';
import { invalidInput } from '../http';

const extensions = recordExtensions();
const schema = getSchema(extensions);

export const MAX_BODY_CHARS = 400_000;
const MAX_DEPTH = 40;
const HEADING_LEVELS = [2, 3];
const MAX_LIST_START = 100_000;
export const MAX_IMAGE_ALT = 500;

/** An image's words: plain text on one line, at most MAX_IMAGE_ALT characters, or none. */
const validImageText = (v: unknown) =>
  v === null || (typeof v === 'string' && v.length <= MAX_IMAGE_ALT && !/[\u0000-\u001f\u007f]/.test(v));

export interface ProcessedBody {
  doc: JSONContent;
  html: string;
  text: string;
}

interface AttrRule {
  valid: (value: unknown) => boolean;
  /** Used instead of a bad value when a stored document is repaired for display. */
  fallback: unknown;
  required?: boolean;
  message: string;
}

/**
 * The only node attributes a stored record keeps, with the values each may take. The schema checks node types but
 * not attribute values, so without this list any string would reach the stored JSON and the rendered HTML.
 */
const NODE_ATTRS: Record<string, Record<string, AttrRule>> = {
  heading: {
    level: {
      valid: (v) => HEADING_LEVELS.includes(v as number),
      fallback: HEADING_LEVELS[0],
      required: true,
      message: 'Headings may be level 2 or 3.',
    },
  },
  codeBlock: {
    language: {
      valid: (v) => v === null || (typeof v === 'string' && /^[a-z0-9+#-]{1,32}$/.test(v)),
      fallback: null,
      message: 'A code block language is a short name of lower-case letters, digits, +, # or -.',
    },
  },
  orderedList: {
    start: {
      valid: (v) => Number.isSafeInteger(v) && (v as number) >= 1 && (v as number) <= MAX_LIST_START,
      fallback: 1,
      message: `A numbered list starts at a whole number from 1 to ${MAX_LIST_START}.`,
    },
  },
  image: {
    src: {
      valid: isAttachmentSrc,
      fallback: null,
      required: true,
      message: 'An image in the text may show only one of this record’s attachments (/api/attachments/<id>).',
    },
    alt: {
      valid: validImageText,
      fallback: null,
      message: `An image description is one line of at most ${MAX_IMAGE_ALT} characters.`,
    },
    title: {
      valid: validImageText,
      fallback: null,
      message: `An image title is one line of at most ${MAX_IMAGE_ALT} characters.`,
    },
  },
  taskItem: {
    checked: { valid: (v) => typeof v === 'boolean', fallback: false, message: 'A task is either done or not.' },
  },
};

class BodyProblem extends Error {}

/**
 * Validates a ProseMirror document against the editor's own schema and the attribute allow-list, drops unsafe links
 * and every link attribute but `href`, and renders the HTML and plain text the app shows and searches. Client HTML
 * is never accepted; this HTML comes from the validated tree. `repair` (for stored revisions written before a rule
 * existed) replaces a bad attribute value instead of refusing the document.
 */
export function processBody(input: unknown, { repair = false } = {}): ProcessedBody {
  const fail = (message: string) => invalidInput([{ path: 'body', message }], 'The record text could not be read.');
  if (!input || typeof input !== 'object' || Array.isArray(input)) throw fail('The body must be an editor document.');
  let cleaned: JSONContent;
  try {
    // A root that was only an empty list comes back null and is refused below as not a document.
    cleaned = withoutPrompts(clean(input, 0, repair) ?? { type: 'empty list' });
  } catch (e) {
    if (e instanceof BodyProblem) throw fail(e.message);
    throw e;
  }
  // Measured on the cleaned copy: it is bounded in depth, so serialising it cannot overflow the stack.
  if (JSON.stringify(cleaned).length > MAX_BODY_CHARS)
    throw fail(`The text is too long (over ${MAX_BODY_CHARS / 1000}k characters of document).`);
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
  const doc = keepOnlyLinkHref(node.toJSON() as JSONContent);
  return { doc, html: generateHTML(doc, extensions), text: node.textBetween(0, node.content.size, '\n', ' ').trim() };
}

const LISTS = new Set(['bulletList', 'orderedList', 'taskList']);
const PROMPTS = new Set(SECTION_PROMPTS);

const plainText = (n: JSONContent): string =>
  typeof n.text === 'string' ? n.text : (n.content ?? []).map(plainText).join('');

/** A list item with nothing in it but empty paragraphs (the one Enter leaves behind at the end of a list). */
function isBlankItem(item: JSONContent): boolean {
  return (item.content ?? []).every(
    (c) =>
      c.type === 'paragraph' &&
      (c.content ?? []).every((x) => x.type === 'hardBreak' || (x.type === 'text' && !x.text?.trim())),
  );
}

/**
 * Section prompts are placeholders in today's editor and never part of a document; an older editor (or a draft
 * kept in a browser since then) sent them as text, so a top-level paragraph that is exactly a prompt is dropped.
 * A person writing that exact sentence as their own content is not a case worth keeping it for.
 */
function withoutPrompts(doc: JSONContent): JSONContent {
  if (!Array.isArray(doc.content)) return doc;
  const content = doc.content.filter((b) => !(b.type === 'paragraph' && PROMPTS.has(plainText(b).trim())));
  return { ...doc, content: content.length ? content : [{ type: 'paragraph' }] };
}

/**
 * Copies only the known shape of a node: allowed attributes with allowed values, safe links with only `href`.
 * Empty items at the end of a list are left out (null for a list that had nothing else).
 */
function clean(n: JSONContent, depth: number, repair: boolean): JSONContent | null {
  if (depth > MAX_DEPTH) throw new BodyProblem('The document is nested too deeply.');
  const out: JSONContent = { type: String(n.type ?? '') };
  // A stored image whose address is not an attachment's cannot be shown safely: repairing drops it.
  if (repair && out.type === 'image' && !isAttachmentSrc((n.attrs as Record<string, unknown> | undefined)?.src))
    return null;
  const attrs = cleanAttrs(out.type!, n.attrs, repair);
  if (attrs) out.attrs = attrs;
  if (typeof n.text === 'string') out.text = n.text;
  if (Array.isArray(n.marks)) {
    out.marks = n.marks
      .filter((m) => m && typeof m === 'object' && typeof m.type === 'string')
      .filter((m) => m.type !== 'link' || isSafeHref(m.attrs?.href))
      .map((m) => (m.type === 'link' ? { type: 'link', attrs: { href: m.attrs!.href as string } } : { type: m.type }));
  }
  if (Array.isArray(n.content)) {
    const kids: JSONContent[] = [];
    for (const child of n.content) {
      if (!child || typeof child !== 'object') continue;
      const kid = clean(child, depth + 1, repair);
      if (kid) kids.push(kid);
    }
    if (LISTS.has(out.type!)) {
      while (kids.length && isBlankItem(kids[kids.length - 1])) kids.pop();
      if (kids.length === 0) return null;
    }
    out.content = kids;
  }
  return out;
}

function cleanAttrs(type: string, given: unknown, repair: boolean): Record<string, unknown> | undefined {
  const rules = NODE_ATTRS[type];
  if (!rules) return undefined;
  const source = given && typeof given === 'object' && !Array.isArray(given) ? (given as Record<string, unknown>) : {};
  const out: Record<string, unknown> = {};
  for (const [name, rule] of Object.entries(rules)) {
    const value = source[name];
    if (value === undefined && !rule.required) continue;
    if (rule.valid(value)) out[name] = value;
    else if (repair) out[name] = rule.fallback;
    else throw new BodyProblem(rule.message);
  }
  return Object.keys(out).length ? out : undefined;
}

/** The link mark's other attributes get schema defaults on the way through ProseMirror; none of them is stored. */
function keepOnlyLinkHref(n: JSONContent): JSONContent {
  const out: JSONContent = { ...n };
  if (n.marks)
    out.marks = n.marks.map((m) =>
      m.type === 'link' ? { type: 'link', attrs: { href: m.attrs?.href as unknown } } : m,
    );
  if (n.content) out.content = n.content.map(keepOnlyLinkHref);
  return out;
}
