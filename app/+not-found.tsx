import { Link } from 'expo-router';
import { PublicCard } from '@/features/shell/components/public-card';
import { Text } from '@/features/ui/components/text';

export default function NotFoundScreen() {
  return (
    <PublicCard title="Page not found" subtitle="This address does not lead anywhere in Squadline.">
      <Link href="/" style={{ minHeight: 48, paddingVertical: 12 }}>
        <Text variant="label">Go to the home page</Text>
      </Link>
    </PublicCard>
  );
}
