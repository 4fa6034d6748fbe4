import { useLocalSearchParams } from 'expo-router';
import { AcceptInvitationForm } from '@/features/auth/components/accept-invitation-form';
import { PublicCard } from '@/features/shell/components/public-card';

export default function AcceptInviteScreen() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return (
    <PublicCard title="Join your club">
      <AcceptInvitationForm token={token ?? ''} />
    </PublicCard>
  );
}
