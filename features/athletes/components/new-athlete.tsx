import { can } from '@/features/access/permissions';
import { useRouter } from 'expo-router';
import { useActiveClub } from '@/features/session/active-club';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { useCreateAthleteMutation } from '../api/create-athlete';
import { LazyAthleteForm } from './lazy-athlete-form';

/** Adds one athlete, then opens their page (where consent and parents are recorded). */
export function NewAthlete() {
  const { membership } = useActiveClub();
  const create = useCreateAthleteMutation();
  const router = useRouter();
  if (!can(membership.role, 'roster.manage')) {
    return <Notice>Only the club admin and head coaches add athletes.</Notice>;
  }
  return (
    <Card>
      <Text variant="small" testID="new-athlete-next">
        Next, on the athlete&apos;s page: the family&apos;s decisions about taking part in screening and exercises, photos and e-mail summaries. Nobody is
        screened until the family has agreed.
      </Text>
      <LazyAthleteForm
        submitLabel="Add athlete"
        onCancel={() => router.back()}
        onSubmit={async (values) => {
          const { athlete } = await create.mutateAsync(values);
          router.replace(`/athletes/${athlete.id}`);
        }}
      />
    </Card>
  );
}
