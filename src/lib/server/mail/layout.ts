// Wakebook's e-mail look: one plain-text part and one small HTML part with inline styles (mail clients drop
// stylesheets), on our paper colour with the lake-green accent. Every value is escaped; nothing here is user HTML.

export interface EmailItem {
  title: string;
  url?: string;
  note?: string;
}

export interface EmailSection {
  heading: string;
  items: EmailItem[];
}

export interface EmailContent {
  subject: string;
  /** The first line a mail client shows in its list. */
  preheader: string;
  greeting: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  sections?: EmailSection[];
  /** Small print under the message: why the person got it, what to do if it was not for them. */
  footer: string[];
}

export interface RenderedEmail {
  subject: string;
  text: string;
  html: string;
}

const PAPER = '#f6f1e6';
const SURFACE = '#fffcf5';
const INK = '#17251e';
const MUTED = '#52605a';
const LINE = '#d9d0bd';
const LAKE = '#115e56';

export function escapeHtml(s: string): string {
  return s
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

export function renderEmail(c: EmailContent): RenderedEmail {
  return { subject: c.subject, text: renderText(c), html: renderHtml(c) };
}

function renderText(c: EmailContent): string {
  const lines: string[] = [c.greeting, ''];
  for (const p of c.paragraphs) lines.push(p, '');
  if (c.action) lines.push(`${c.action.label}:`, c.action.url, '');
  for (const s of c.sections ?? []) {
    lines.push(s.heading, '-'.repeat(Math.min(60, s.heading.length)));
    for (const i of s.items) {
      lines.push(`* ${i.title}${i.note ? ` (${i.note})` : ''}`);
      if (i.url) lines.push(`  ${i.url}`);
    }
    lines.push('');
  }
  lines.push('--', ...c.footer, 'Wakebook, the handover archive of your team');
  return lines.join('\n');
}

function renderHtml(c: EmailContent): string {
  const p = (text: string) =>
    `<p style="margin:0 0 14px 0;font-size:16px;line-height:1.55;color:${INK}">${escapeHtml(text)}</p>`;
  const button = c.action
    ? `<p style="margin:22px 0"><a href="${escapeHtml(c.action.url)}" style="display:inline-block;background:${LAKE};color:${SURFACE};text-decoration:none;font-weight:bold;padding:11px 20px;border-radius:7px;font-size:16px">${escapeHtml(c.action.label)}</a></p>
<p style="margin:0 0 14px 0;font-size:13px;line-height:1.5;color:${MUTED}">If the button does not work, copy this address into your browser:<br><a href="${escapeHtml(c.action.url)}" style="color:${LAKE};word-break:break-all">${escapeHtml(c.action.url)}</a></p>`
    : '';
  const sections = (c.sections ?? [])
    .map(
      (s) => `<h2 style="margin:24px 0 8px 0;font-size:17px;color:${INK}">${escapeHtml(s.heading)}</h2>
<ul style="margin:0 0 8px 0;padding-left:20px;color:${INK};font-size:15px;line-height:1.5">${s.items
        .map((i) => {
          const title = i.url
            ? `<a href="${escapeHtml(i.url)}" style="color:${LAKE}">${escapeHtml(i.title)}</a>`
            : escapeHtml(i.title);
          return `<li style="margin:0 0 6px 0">${title}${i.note ? ` <span style="color:${MUTED}">· ${escapeHtml(i.note)}</span>` : ''}</li>`;
        })
        .join('')}</ul>`,
    )
    .join('\n');
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escapeHtml(c.subject)}</title></head>
<body style="margin:0;padding:0;background:${PAPER}">
<span style="display:none;max-height:0;overflow:hidden">${escapeHtml(c.preheader)}</span>
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="background:${PAPER}"><tr><td align="center" style="padding:28px 12px">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="max-width:560px">
<tr><td style="padding:0 4px 14px 4px;font-family:Georgia,'Times New Roman',serif;font-size:22px;font-weight:bold;color:${LAKE}">Wakebook</td></tr>
<tr><td style="background:${SURFACE};border:1px solid ${LINE};border-radius:12px;padding:24px 26px;font-family:system-ui,-apple-system,'Segoe UI',Roboto,Arial,sans-serif">
${p(c.greeting)}
${c.paragraphs.map(p).join('\n')}
${button}
${sections}
</td></tr>
<tr><td style="padding:14px 6px;font-family:system-ui,-apple-system,'Segoe UI',Roboto,Arial,sans-serif;font-size:12px;line-height:1.5;color:${MUTED}">${c.footer.map(escapeHtml).join('<br>')}<br>Wakebook, the handover archive of your team</td></tr>
</table></td></tr></table>
</body></html>`;
}
