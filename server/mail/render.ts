import type { Db } from '@/db/client';
import { linkMail } from '@/server/auth/link-mail';
import { summaryMail } from '@/server/care/summary-mail';
import type { RenderMail } from './outbox';

/** Renders every queued reference at send time: invitations and resets (auth), family summaries (care). */
export function mailRenderer(db: Db, publicUrl: string): RenderMail {
  const links = linkMail(db, publicUrl);
  const summaries = summaryMail(db, publicUrl);
  return (ref) => (ref.template === 'family-summary' ? summaries(ref.id) : links(ref));
}
