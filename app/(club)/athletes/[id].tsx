import { useLocalSearchParams } from 'expo-router';
import { AthleteProfile } from '@/features/athletes/components/athlete-profile';
import { AthleteRecords } from '@/features/athletes/components/athlete-records';
import { LazyAthleteProgress } from '@/features/progress/components/lazy-progress';
import { AthleteCare } from '@/features/care/components/athlete-care';
import { AthleteAssessments } from '@/features/screening/components/athlete-assessments';
import { Page } from '@/features/ui/components/page';

export default function AthleteScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const athleteId = String(id);
  return (
    <Page>
      <AthleteProfile id={athleteId} />
      <AthleteRecords id={athleteId} />
      <LazyAthleteProgress athleteId={athleteId} />
      <AthleteCare athleteId={athleteId} />
      <AthleteAssessments athleteId={athleteId} />
    </Page>
  );
}
