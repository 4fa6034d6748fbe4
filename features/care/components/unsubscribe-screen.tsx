import { useEffect } from 'react';
import { View } from 'react-native';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { useUnsubscribeMutation } from '../api/unsubscribe';

/** The page behind the e-mail's "Stop these e-mails" link: records the choice once, then says so. */
export function UnsubscribeScreen({ token }: { token: string }) {
  const mutation = useUnsubscribeMutation();
  const { mutate } = mutation;
  useEffect(() => {
    if (token) mutate(token);
  }, [token, mutate]);
  if (!token) return <Notice tone="error">This link is incomplete. Please use the link from the e-mail.</Notice>;
  if (mutation.error) return <Notice tone="error">{mutation.error.message}</Notice>;
  if (!mutation.data) return <Text>Recording your choice…</Text>;
  return (
    <View testID="unsubscribed">
      <Notice title="No more summary e-mails">
        {`We recorded that you do not want e-mailed summaries about ${mutation.data.athleteFirstName}. If you change your mind, turn them back on from ${mutation.data.athleteFirstName}'s page in Squadline, or ask the club. Summaries stay readable in Squadline.`}
      </Notice>
    </View>
  );
}
