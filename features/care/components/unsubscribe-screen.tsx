import { StyleSheet, View } from 'react-native';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { space } from '@/features/ui/theme';
import { useUnsubscribeMutation } from '../api/unsubscribe';

/**
 * The page behind the e-mail's "Stop these e-mails" link: the choice is recorded when the parent presses
 * the button, not when the page opens (common practice, no source: mail filters open links on their own,
 * and one of them would otherwise stop the family's e-mails), then said with where to undo it.
 */
export function UnsubscribeScreen({ token }: { token: string }) {
  const mutation = useUnsubscribeMutation();
  if (!token) return <Notice tone="error">This link is incomplete. Please use the link from the e-mail.</Notice>;
  if (mutation.data) {
    const name = mutation.data.athleteFirstName;
    return (
      <View testID="unsubscribed">
        <Notice title="No more summary e-mails">
          {`We recorded that your family does not want e-mailed summaries about ${name}: the e-mails stop for every parent linked to ${name}. Summaries stay readable in Squadline. To turn them back on, open ${name}'s page in Squadline, then “Details and your consent”, or ask the club.`}
        </Notice>
      </View>
    );
  }
  return (
    <View style={styles.ask} testID="unsubscribe-ask">
      <Text variant="title" accessibilityRole="header">
        Stop the summary e-mails?
      </Text>
      <Text>
        The club e-mails a summary after each screen it has reviewed. Stopping them is one choice for the family: the e-mails stop for every parent linked to
        the child. The summaries stay readable in Squadline, and the e-mails can be turned back on there.
      </Text>
      {mutation.error ? <Notice tone="error">{mutation.error.message}</Notice> : null}
      <Button label="Stop the e-mails" busy={mutation.isPending} onPress={() => mutation.mutate(token)} testID="unsubscribe-confirm" />
    </View>
  );
}

const styles = StyleSheet.create({ ask: { gap: space.md } });
