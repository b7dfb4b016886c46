/**
 * The shared frame of every Sheetsmith e-mail: HTML escaping, one plain layout (a heading, paragraphs, one
 * button-like link, small print) and its plain-text twin, so both parts of a message always say the same.
 * The HTML uses inline styles and tables only, since many mail readers drop <style> blocks.
 */

/** Returns `value` with the five HTML-special characters replaced by entities (safe in text and quoted attributes). */
export function escapeHtml(value: string): string {
  return value.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

/** The parts of one mail; every string is plain text (escaped here), never HTML. */
export interface MailLayout {
  heading: string;
  /** Paragraphs before the link. */
  paragraphs: string[];
  /** The one thing to click, shown as a button in HTML and as a bare URL in text. */
  action?: { label: string; url: string };
  /** Paragraphs after the link (expiry, what to do if it was not you). */
  after?: string[];
}

/** Returns the plain-text body: heading, paragraphs, the link on a line of its own, then the small print. */
export function layoutText(mail: MailLayout): string {
  const lines = [mail.heading, '', ...mail.paragraphs.flatMap((p) => [p, ''])];
  if (mail.action) lines.push(`${mail.action.label}:`, mail.action.url, '');
  for (const p of mail.after ?? []) lines.push(p, '');
  lines.push('-- ', 'Sheetsmith: flat foam patterns from a 3D sculpt');
  return lines.join('\n');
}

const INK = '#2b2118';
const ACCENT = '#b5532a';

/** Returns the HTML body with the same content as `layoutText`. */
export function layoutHtml(mail: MailLayout): string {
  const para = (p: string) => `<p style="margin:0 0 14px 0;line-height:1.5">${escapeHtml(p)}</p>`;
  const action = mail.action
    ? `<p style="margin:20px 0"><a href="${escapeHtml(mail.action.url)}" style="background:${ACCENT};color:#ffffff;padding:10px 18px;border-radius:4px;text-decoration:none;font-weight:bold">${escapeHtml(mail.action.label)}</a></p>` +
      `<p style="margin:0 0 14px 0;font-size:13px;color:#6b5d50">Or paste this address into your browser: ${escapeHtml(mail.action.url)}</p>`
    : '';
  return [
    '<!doctype html><html><body style="margin:0;padding:0;background:#f4efe8">',
    `<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="background:#f4efe8;padding:24px 0"><tr><td align="center">`,
    `<table role="presentation" width="560" cellpadding="0" cellspacing="0" style="background:#ffffff;color:${INK};font-family:Helvetica,Arial,sans-serif;font-size:15px;padding:28px;border-top:6px solid ${ACCENT}"><tr><td>`,
    `<h1 style="font-size:20px;margin:0 0 18px 0">${escapeHtml(mail.heading)}</h1>`,
    ...mail.paragraphs.map(para),
    action,
    ...(mail.after ?? []).map(para),
    `<p style="margin:24px 0 0 0;font-size:12px;color:#6b5d50">Sheetsmith: flat foam patterns from a 3D sculpt</p>`,
    '</td></tr></table></td></tr></table></body></html>',
  ].join('');
}
