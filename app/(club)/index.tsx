import { RoleHome } from '@/features/home/components/role-home';
import { Page } from '@/features/ui/components/page';

export default function HomeScreen() {
  return (
    <Page title="Home">
      <RoleHome />
    </Page>
  );
}
