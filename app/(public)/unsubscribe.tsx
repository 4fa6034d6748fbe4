import { useLocalSearchParams } from 'expo-router';
import { UnsubscribeScreen } from '@/features/care/components/unsubscribe-screen';
import { PublicCard } from '@/features/shell/components/public-card';

export default function UnsubscribeRoute() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return (
    <PublicCard title="Summary e-mails">
      <UnsubscribeScreen token={token ?? ''} />
    </PublicCard>
  );
}
