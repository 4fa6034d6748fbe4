import { Link } from 'expo-router';
import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { can } from '@/features/access/permissions';
import { messageOf } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { scrollToId } from '@/features/ui/scroll-to';
import { colors, radius, space } from '@/features/ui/theme';
import { useAssessmentCareQuery, useMarkReviewedMutation, useReleaseMutation, useReleasePreviewQuery } from '../api/assessment-care';
import { LazyCarePanels } from './lazy-care-panels';
import { useReviewsQuery } from '../api/get-reviews';
import type { ReleasePreview } from '../types';
import { formatDate } from '@/features/ui/format-date';

/**
 * The care team's part of a result: the review mark, release to the family with a preview of the
 * e-mail, the clearance and the notes. The strength-work hold is shown inside the plan (PlanSection).
 */
/** The element id of the panel, for the link under the athlete's name on a phone. */
export const CARE_ANCHOR = 'result-care';

export function ResultCarePanel({ assessmentId, athleteId }: { assessmentId: string; athleteId: string }) {
  const { membership } = useActiveClub();
  const care = useAssessmentCareQuery(assessmentId);
  // Held here, not in <Release>: a refetch after another care change (a note, the review mark) must not
  // close an open preview or hide the "Sent" notice when the refetched state says "released".
  const [previewing, setPreviewing] = useState(false);
  const release = useReleaseMutation(assessmentId);
  if (care.isPending) return null;
  // A failed refetch keeps what was read: the panel (and a preview being read) stays in place.
  if (!care.data) return <Notice tone="error">{care.error?.message ?? 'The care details could not be read.'}</Notice>;
  const c = care.data.care;
  return (
    <View style={styles.wrap} testID="result-care" nativeID={CARE_ANCHOR}>
      <Card>
        <Text variant="heading" accessibilityRole="header" aria-level={2}>
          Review and family summary
        </Text>
        <Text testID="review-state">
          {c.reviewedAt ? `Reviewed by ${c.reviewedByName ?? 'a former member'} on ${formatDate(c.reviewedAt)}.` : 'Not reviewed yet.'}{' '}
          {c.releasedAt ? `Released for the family's page on ${formatDate(c.releasedAt)}.` : 'Not released to the family yet.'}
        </Text>
        {!c.reviewedAt && can(membership.role, 'review.mark') ? <MarkReviewed assessmentId={assessmentId} /> : null}
        {(release.isSuccess || (c.reviewedAt && !c.releasedAt)) && can(membership.role, 'summary.release') ? (
          <Release assessmentId={assessmentId} previewing={previewing} setPreviewing={setPreviewing} release={release} />
        ) : null}
        {c.reviewedAt && can(membership.role, 'review.read') ? <NextToReview assessmentId={assessmentId} /> : null}
        {c.releasedAt || release.isSuccess ? (
          // What the family received, as they read it (the newest shared screen's summary).
          <Link href={`/family/${athleteId}`} style={styles.link} testID="open-family-view">
            <Text variant="label" style={styles.linkText}>
              See the summary as the family reads it →
            </Text>
          </Link>
        ) : null}
      </Card>
      <LazyCarePanels athleteId={athleteId} assessmentId={assessmentId} />
    </View>
  );
}

/** Once this screen is reviewed, the next one waiting (most urgent first), or the list: no trip back to find it. */
function NextToReview({ assessmentId }: { assessmentId: string }) {
  const reviews = useReviewsQuery();
  const next = reviews.data?.reviews.find((r) => r.assessmentId !== assessmentId);
  return (
    <Link href={next ? `/screening/assessments/${next.assessmentId}/result?from=reviews` : '/reviews'} style={styles.link} testID="next-to-review">
      <Text variant="label" style={styles.linkText}>
        {next ? `Next to review: ${next.firstName} ${next.lastName} →` : 'Back to the review list →'}
      </Text>
    </Link>
  );
}

function MarkReviewed({ assessmentId }: { assessmentId: string }) {
  const mark = useMarkReviewedMutation(assessmentId);
  return (
    <View style={styles.actions}>
      {mark.error ? <Notice tone="error">{messageOf(mark.error)}</Notice> : null}
      <Button label="Mark as reviewed" busy={mark.isPending} onPress={() => mark.mutate()} testID="mark-reviewed" />
      <Text variant="small">To change the plan, use the plan section first: changes go into the plan history with their reason.</Text>
    </View>
  );
}

type ReleaseProps = {
  assessmentId: string;
  previewing: boolean;
  setPreviewing: (on: boolean) => void;
  release: ReturnType<typeof useReleaseMutation>;
};

const RELEASE_ACTIONS = 'release-actions';

function Release({ assessmentId, previewing, setPreviewing, release }: ReleaseProps) {
  const preview = useReleasePreviewQuery(assessmentId, previewing && !release.isSuccess);
  if (release.isSuccess) return <Released sent={release.data.release.recipients} preview={preview.data?.preview} />;
  if (!previewing) return <Button label="Preview the family summary" tone="secondary" onPress={() => setPreviewing(true)} testID="release-preview" />;
  if (preview.isPending) return <Text>Preparing the preview…</Text>;
  if (preview.error) return <Notice tone="error">{preview.error.message}</Notice>;
  const p = preview.data.preview;
  return (
    <View style={styles.actions} testID="release-panel">
      <Text variant="label">
        {p.recipients.length > 0
          ? `E-mail to: ${p.recipients.map((r) => `${r.displayName} <${r.email}>`).join(', ')}`
          : p.skipped.length > 0
            ? 'No parent will get an e-mail (below, why).'
            : 'No parent will get an e-mail: no parent account is linked to this athlete. The summary still shows in the app once a parent is linked.'}
      </Text>
      {p.skipped.map((s) => (
        <Text key={s.displayName} variant="small">
          {s.displayName}: {s.reason}
        </Text>
      ))}
      <Text variant="small">Subject: {p.subject}</Text>
      {/* The e-mail runs to a few screens on a phone: the decision is one tap away once read, or skimmed. */}
      <Button label="To the release button ↓" tone="quiet" onPress={() => scrollToId(RELEASE_ACTIONS, true)} testID="release-jump" />
      <View style={styles.preview} testID="email-preview">
        <Text style={styles.previewText}>{p.text}</Text>
      </View>
      {release.error ? <Notice tone="error">{messageOf(release.error)}</Notice> : null}
      <View style={styles.row} nativeID={RELEASE_ACTIONS}>
        <Button label="Release to the family" busy={release.isPending} onPress={() => release.mutate()} testID="release-confirm" />
        <Button label="Not now" tone="quiet" onPress={() => setPreviewing(false)} />
      </View>
    </View>
  );
}

/**
 * What the release did, in full: who can read it and who was e-mailed. With no parent linked, "Sent" had
 * told a physiotherapist the family was informed when nobody was (the preview had said so, above).
 */
function Released(props: { sent: number; preview: ReleasePreview | undefined }) {
  // The preview above it folds away as it appears: brought into view, or it was read by nobody (it sat
  // above the top of a phone's screen).
  useEffect(() => scrollToId(RELEASED), []);
  return (
    <View nativeID={RELEASED}>
      <ReleasedWords {...props} />
    </View>
  );
}

const RELEASED = 'release-done';

function ReleasedWords({ sent, preview }: { sent: number; preview: ReleasePreview | undefined }) {
  if (sent > 0)
    return (
      <Notice
        title="Released"
        testID="released"
      >{`The summary is in the family view and ${sent === 1 ? 'one e-mail is' : `${sent} e-mails are`} on their way.`}</Notice>
    );
  if (preview && preview.skipped.length > 0) {
    return (
      <Notice title="Released, no e-mail sent" testID="released">
        {`The summary is in the family view for ${preview.skipped.map((s) => s.displayName).join(', ')}; no e-mail went out (no e-mail consent recorded).`}
      </Notice>
    );
  }
  return (
    <Notice tone="caution" title="Released, but no family can read it yet" testID="released">
      No parent account is linked to this athlete, so nobody has been told. The summary shows in the family view once the club links a parent.
    </Notice>
  );
}

const styles = StyleSheet.create({
  link: { minHeight: 48, justifyContent: 'center', display: 'flex', alignSelf: 'flex-start' },
  linkText: { color: colors.pine },
  wrap: { gap: space.lg },
  actions: { gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  preview: {
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.md,
    padding: space.md,
    backgroundColor: colors.paper,
    // In full, not in a box of its own that scrolls: on a phone only its first lines showed, and the
    // clearance and the next check (what a physiotherapist checks before release) needed a scroll inside it.
  },
  previewText: { fontSize: 15, lineHeight: 21 },
});
