/** The HTML part of a caught mail, off the web: its source as text (the web version renders it, mail-html-view.web.tsx). */
import { Text } from '../ui/text';

/** Renders the HTML part `html` of the mail titled `subject` as monospaced source. */
export function MailHtmlView({ html, subject }: { html: string; subject: string }) {
  return (
    <Text variant="mono" accessibilityLabel={`HTML of ${subject}`} selectable>
      {html}
    </Text>
  );
}
