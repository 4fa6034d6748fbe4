import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';
import { PublicCard } from '@/features/shell/components/public-card';

export default function ForgotPasswordScreen() {
  return (
    <PublicCard title="Reset your password" subtitle="We e-mail you a link to choose a new password.">
      <ForgotPasswordForm />
    </PublicCard>
  );
}
