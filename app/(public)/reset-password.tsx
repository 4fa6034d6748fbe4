import { useLocalSearchParams } from 'expo-router';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';
import { PublicCard } from '@/features/shell/components/public-card';

export default function ResetPasswordScreen() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return (
    <PublicCard title="Choose a new password">
      <ResetPasswordForm token={token ?? ''} />
    </PublicCard>
  );
}
