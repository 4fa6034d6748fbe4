import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { useReviewsQuery } from '../api/get-reviews';
import type { ReviewItem } from '../types';
import { ClearanceBadge } from './clearance-badge';
import { formatDate } from '@/features/ui/format-date';

/** The physiotherapist's list: screens to review (pain or "clearance needed" first), then those awaiting release. */
export function ReviewList() {
  const query = useReviewsQuery();
  // A wide screen lays the rows out two by two: a physiotherapist sees twice as many without scrolling.
  const { isWide } = useBreakpoints();
  if (query.isPending) return <Text>Loading the review list…</Text>;
  if (query.error) return <Notice tone="error">{query.error.message}</Notice>;
  const { reviews, awaitingRelease } = query.data;
  return (
    <View style={styles.wrap}>
      <View style={styles.head}>
        <Text variant="title" accessibilityRole="header">
          To review
        </Text>
        <Text variant="small">
          {reviews.length === 0
            ? 'Nothing waiting. Well done.'
            : `${reviews.length} submitted ${reviews.length === 1 ? 'screen' : 'screens'}, most urgent first.`}
        </Text>
      </View>
      <View style={[styles.list, isWide && styles.listWide]} testID="review-list">
        {reviews.map((r) => (
          <ReviewRow key={r.assessmentId} item={r} wide={isWide} />
        ))}
      </View>
      {awaitingRelease.length > 0 ? (
        <>
          <Text variant="heading" accessibilityRole="header" aria-level={2}>
            Reviewed, not yet sent to the family
          </Text>
          <View style={[styles.list, isWide && styles.listWide]} testID="release-list">
            {awaitingRelease.map((r) => (
              <ReviewRow key={r.assessmentId} item={r} wide={isWide} />
            ))}
          </View>
        </>
      ) : null}
    </View>
  );
}

function ReviewRow({ item, wide }: { item: ReviewItem; wide: boolean }) {
  const urgent = item.painReported || item.clearanceNeeded;
  return (
    <Link
      href={`/screening/assessments/${item.assessmentId}/result?from=reviews`}
      style={[styles.row, urgent && styles.urgent, wide && styles.rowWide]}
      testID={`review-${item.athleteId}`}
    >
      <View style={styles.rowInner}>
        <View style={styles.main}>
          <Text variant="label">
            {item.firstName} {item.lastName}
          </Text>
          <Text variant="small">
            {item.squadName ?? 'No squad'} · {item.roundName} · {formatDate(item.screenedOn)}
          </Text>
          <View style={styles.tags}>
            {item.painReported ? <Tag tone="stop" label="Pain reported" /> : null}
            {item.clearanceNeeded && !item.painReported ? <Tag tone="stop" label="Clearance needed" /> : null}
            {item.reviewedAt && item.clearanceNeeded && item.clearance?.status !== 'referred' ? (
              <Tag tone="stop" label="Reviewed · no decision recorded yet" />
            ) : null}
            <Tag
              tone={item.concernCount > 0 ? 'caution' : 'info'}
              label={
                item.flagCount === 0
                  ? 'No flags'
                  : `${item.flagCount} ${item.flagCount === 1 ? 'flag' : 'flags'}${item.concernCount ? `, ${item.concernCount} of concern` : ''}`
              }
            />
            <ClearanceBadge clearance={item.clearance} />
          </View>
        </View>
        <Text style={styles.chevron}>›</Text>
      </View>
    </Link>
  );
}

function Tag({ label, tone }: { label: string; tone: 'stop' | 'caution' | 'info' }) {
  return (
    <View style={[styles.tag, tone === 'stop' ? styles.stop : tone === 'caution' ? styles.caution : styles.info]}>
      <Text variant="small" style={styles.tagText}>
        {label}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  head: { gap: space.xs },
  list: { gap: space.sm },
  listWide: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', columnGap: 0 },
  rowWide: { width: '49%' },
  row: { minHeight: TOUCH_MIN + 24, backgroundColor: colors.surface, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, padding: space.md },
  urgent: { borderLeftWidth: 6, borderLeftColor: colors.brick },
  rowInner: { flexDirection: 'row', alignItems: 'center', gap: space.md, width: '100%' },
  main: { flex: 1, gap: space.xs },
  tags: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  chevron: { fontSize: 28, color: colors.inkMuted },
  tag: { borderRadius: 6, paddingHorizontal: space.sm, paddingVertical: 2 },
  tagText: { color: colors.ink, fontWeight: '700' },
  stop: { backgroundColor: colors.brickSoft },
  caution: { backgroundColor: colors.amberSoft },
  info: { backgroundColor: colors.pineSoft },
});
