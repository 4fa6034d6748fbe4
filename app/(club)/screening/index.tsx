import { ScreeningHome } from '@/features/screening/components/screening-home';
import { Page } from '@/features/ui/components/page';

export default function ScreeningScreen() {
  return (
    <Page title="Screening">
      <ScreeningHome />
    </Page>
  );
}
