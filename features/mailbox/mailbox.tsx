import { queryOptions, useQuery } from '@tanstack/react-query';
import { StyleSheet, View } from 'react-native';
import { api } from '@/features/api/client';
import type { MailboxResponse } from '@/features/mailbox/contract';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { space } from '@/features/ui/theme';
import { formatDateTime } from '@/features/ui/format-date';

export const MAILBOX_REFRESH_MS = 3000;
const mailboxQueryOptions = () =>
  queryOptions({
    queryKey: ['mailbox'] as const,
    queryFn: () => api<MailboxResponse>('/dev/mailbox'),
    refetchInterval: MAILBOX_REFRESH_MS,
  });

/** The local e-mail fake's inbox: what the club's e-mails would look like, without sending any. */
export function Mailbox() {
  const q = useQuery(mailboxQueryOptions());
  if (q.error) return <Notice tone="error">{q.error.message}</Notice>;
  if (q.isPending) return <Text>Loading…</Text>;
  return (
    <View style={styles.wrap}>
      <Notice>E-mails sent by this local copy of Squadline land here instead of real inboxes.</Notice>
      {q.data.messages.length === 0 ? <Text>No e-mail yet.</Text> : null}
      {q.data.messages.map((m) => (
        <Card key={m.id} testID="mail-message">
          <Text variant="label">{m.subject}</Text>
          <Text variant="small">
            To {m.to.join(', ')} · {formatDateTime(m.receivedAt)}
          </Text>
          <Text selectable>{m.text}</Text>
        </Card>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: space.lg } });
