import { Link } from 'expo-router';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { PublicCard } from '@/features/shell/components/public-card';
import { Text } from '@/features/ui/components/text';

export default function SignInScreen() {
  return (
    <PublicCard title="Sign in" subtitle="Movement screening for junior racket squads">
      <SignInForm />
      <Link href="/forgot-password" style={{ minHeight: 48, paddingVertical: 12 }}>
        <Text variant="label">Forgot your password?</Text>
      </Link>
    </PublicCard>
  );
}
