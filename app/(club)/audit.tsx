import { AuditTrail } from '@/features/care/components/audit-trail';
import { Page } from '@/features/ui/components/page';

export default function AuditScreen() {
  return (
    <Page title="Audit trail">
      <AuditTrail />
    </Page>
  );
}
