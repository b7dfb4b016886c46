/**
 * The HTML part of a caught mail on the web: rendered in a sandboxed frame with no scripts, forms or
 * same-origin access (HTML Living Standard, the iframe sandbox attribute), so a mail cannot act inside the app.
 */
import { palette, radius } from '../ui/theme';

/** Renders the HTML part `html` of the mail titled `subject` in an empty-sandbox iframe. */
export function MailHtmlView({ html, subject }: { html: string; subject: string }) {
  return (
    <iframe
      title={`HTML of ${subject}`}
      sandbox=""
      srcDoc={html}
      style={{ width: '100%', height: 420, border: `1px solid ${palette.rule}`, borderRadius: radius.sm, backgroundColor: '#fff' }}
    />
  );
}
