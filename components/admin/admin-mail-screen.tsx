/**
 * Admin: the mail the local catcher has caught (development only): subject, recipient and time in a list;
 * choosing one shows its text part, or its HTML part rendered in a sandboxed frame.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useCaughtMail, type CaughtMail } from '../../hooks/use-admin';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { space } from '../ui/theme';
import { AdminFrame } from './admin-frame';
import { adminTime } from './admin-format';
import { AdminList, type AdminColumn } from './admin-list';
import { MailHtmlView } from './mail-html-view';

const PAGE = 25;

function MailDetail({ mail, onClose }: { mail: CaughtMail; onClose: () => void }) {
  const [part, setPart] = useState<'text' | 'html'>('text');
  return (
    <Card edge>
      <View style={styles.detail}>
        <Text variant="heading" heading={2}>
          {mail.subject || '(no subject)'}
        </Text>
        <Text variant="mono">
          {`From ${mail.from} · to ${mail.to} · ${adminTime(mail.date)}`}
        </Text>
        <View style={styles.buttons}>
          <Button label="Text" compact tone={part === 'text' ? 'primary' : 'secondary'} accessibilityLabel="Show the text part" onPress={() => setPart('text')} />
          <Button label="HTML" compact tone={part === 'html' ? 'primary' : 'secondary'} accessibilityLabel="Show the HTML part" disabled={!mail.html} onPress={() => setPart('html')} />
          <Button label="Close" compact tone="quiet" accessibilityLabel="Close the message" onPress={onClose} />
        </View>
        {part === 'text' ? (
          <Text variant="mono" selectable accessibilityLabel={`Text of ${mail.subject}`}>
            {mail.text || '(no text part)'}
          </Text>
        ) : (
          <MailHtmlView html={mail.html} subject={mail.subject} />
        )}
      </View>
    </Card>
  );
}

/** Renders the caught-mail list and the chosen message. */
export function AdminMailScreen() {
  const mail = useCaughtMail();
  const [page, setPage] = useState(1);
  const [openId, setOpenId] = useState<string | null>(null);
  const all = mail.data?.messages ?? [];
  const open = all.find((m) => m.id === openId) ?? null;
  const columns: AdminColumn<CaughtMail>[] = [
    { label: 'Received', flex: 2, render: (m) => adminTime(m.date) },
    { label: 'To', flex: 3, render: (m) => m.to },
    { label: 'Subject', flex: 4, render: (m) => m.subject || '(no subject)' },
    { label: 'Open', flex: 1, render: (m) => <Button label="Read" compact tone="secondary" accessibilityLabel={`Read ${m.subject}`} onPress={() => setOpenId(m.id)} /> },
  ];
  return (
    <AdminFrame title="Mail">
      {mail.error ? (
        <Notice tone={mail.error.message.includes('MAIL_CATCHER_URL') ? 'note' : 'error'} title="No caught mail to show">
          {mail.error.message}
        </Notice>
      ) : null}
      {open ? <MailDetail mail={open} onClose={() => setOpenId(null)} /> : null}
      {mail.data ? (
        <AdminList caption="Caught mail" columns={columns} rows={all.slice((page - 1) * PAGE, page * PAGE)} rowKey={(m) => m.id} empty="The catcher has no mail yet." page={page} pageSize={PAGE} total={all.length} onPage={setPage} />
      ) : mail.isPending ? (
        <Loading label="Loading caught mail" />
      ) : null}
    </AdminFrame>
  );
}

const styles = StyleSheet.create({
  detail: { gap: space.sm },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
});
