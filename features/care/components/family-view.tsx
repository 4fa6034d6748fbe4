import { Link, useRouter } from 'expo-router';
import { useActiveClub } from '@/features/session/active-club';
import { Button } from '@/features/ui/components/button';
import { Image, StyleSheet, View } from 'react-native';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space } from '@/features/ui/theme';
import { useFamilyViewQuery } from '../api/get-family-view';
import type { FamilyComparison, FamilySummary, FamilyView as FamilyViewData, SummaryRelease } from '../types';
import { formatDate } from '@/features/ui/format-date';
import { familyReleases } from '../family-releases';
import { todayIso } from '@/features/athletes/age';
import { CLUB_ONLY_WORDS, recheckWords, sessionsSinceWords } from '../family-words';

/** A parent's page for one child: the latest released summary in plain words, the plan with how-to, family notes, earlier summaries. */
export function FamilyView({ athleteId }: { athleteId: string }) {
  const query = useFamilyViewQuery(athleteId);
  const { isWide } = useBreakpoints();
  const { membership } = useActiveClub();
  const router = useRouter();
  if (query.isPending) return <Text>Loading…</Text>;
  if (query.error) return <Notice tone="error">{query.error.message}</Notice>;
  const { athlete, takingPart, latest, comparison, sessionsSinceLatest, notes, photos } = query.data;
  const { firstSharedAt, updatedAt, earlier } = familyReleases(latest, query.data.earlier);
  const photosCard = !query.data.clubSharesPhotos ? (
    // Said, so that "photos: agreed" on the consent page does not leave a parent looking for them.
    <Text variant="small" testID="family-photos-kept">
      The club keeps screening photos for the coaches and the physiotherapist: it does not show them on families&apos; pages.
    </Text>
  ) : photos.length > 0 ? (
    <Card>
      <Text variant="heading">Photos from the screen</Text>
      <View style={styles.photos}>
        {photos.map((p) => (
          <Image key={p.id} source={{ uri: p.thumbUrl }} accessibilityLabel={p.taskTitle} style={styles.photo} />
        ))}
      </View>
    </Card>
  ) : null;
  const notesCard = (
    <Card testID="family-notes">
      <Text variant="heading">Notes from the care team</Text>
      {notes.length === 0 ? <Text variant="small">No notes for you yet.</Text> : null}
      {notes.map((n) => (
        <View key={n.id} style={styles.note}>
          <Text variant="small">
            {n.authorName ?? 'The club'} · {formatDate(n.createdAt)}
          </Text>
          <Text>{n.text}</Text>
        </View>
      ))}
    </Card>
  );
  // On a wide screen the notes, photos and earlier summaries sit under the plan, beside the summary (the
  // page's two halves about the same length); on a phone they follow in reading order.
  const beside = isWide && latest;
  return (
    <View style={styles.wrap} testID="family-view">
      {/* Staff open this page from a result to check what went out: said, with the way back. */}
      {membership.role !== 'parent' ? (
        <Notice title="What the family reads" testID="family-preview-banner">
          <View style={styles.banner}>
            <Text>{`${athlete.firstName}'s page as a linked parent sees it: "you" is the parent.`}</Text>
            {router.canGoBack() ? <Button label="← Back" tone="quiet" onPress={() => router.back()} testID="family-preview-back" /> : null}
          </View>
        </Notice>
      ) : null}
      <Text variant="title" accessibilityRole="header">
        {athlete.firstName} {athlete.lastName}
      </Text>
      {takingPart?.granted ? null : (
        <NotTakingPart athlete={athlete} stoppedOn={takingPart?.decidedOn ?? null} hasPlan={!!latest && latest.summary.exercises.length > 0} />
      )}
      {/* First after the name: the decision a parent acts on (what waits, who to see), not a card away. */}
      {latest?.summary.clearance ? (
        <Notice title="Physiotherapist's decision" testID="family-clearance">
          {`${latest.summary.clearance} Any question: ask the person under “Who to ask” below.`}
        </Notice>
      ) : null}
      {!latest ? (
        <Notice title="No summary yet">{`When ${athlete.firstName}'s next screen has been reviewed and shared with you, its summary appears here.`}</Notice>
      ) : (
        <View style={[styles.wrap, isWide && styles.columns]}>
          <View style={[styles.wrap, isWide && styles.column]}>
            <Summary summary={latest.summary} releasedAt={firstSharedAt ?? latest.releasedAt} updatedAt={updatedAt} />
            {comparison ? <Comparison comparison={comparison} /> : null}
          </View>
          <View style={[styles.wrap, isWide && styles.column]}>
            <Plan summary={latest.summary} sessions={sessionsSinceLatest} />
            {beside ? notesCard : null}
            {beside ? photosCard : null}
            {beside && earlier.length > 0 ? <Earlier releases={earlier} /> : null}
          </View>
        </View>
      )}
      {beside ? null : photosCard}
      {beside ? null : notesCard}
      {!beside && earlier.length > 0 ? <Earlier releases={earlier} /> : null}
      {/* Where a parent changes what they agreed to, whatever the page above says. */}
      {takingPart?.granted ? (
        <Link href={`/athletes/${athlete.id}`} style={styles.consentLink} testID="family-details-link">
          <Text variant="label">{`${athlete.firstName}'s details and your consent decisions →`}</Text>
        </Link>
      ) : null}
    </View>
  );
}

/** The family has stopped screens and exercises, or never agreed: said first, with where to change it. */
function NotTakingPart({ athlete, stoppedOn, hasPlan }: { athlete: FamilyViewData['athlete']; stoppedOn: string | null; hasPlan: boolean }) {
  const name = athlete.firstName;
  return (
    <Notice
      tone="caution"
      title={stoppedOn ? `Screens and exercises stopped on ${formatDate(stoppedOn)}` : 'Screens and exercises: not agreed yet'}
      testID="family-not-taking-part"
    >
      <Text>
        {stoppedOn
          ? `The club does not screen ${name} now${hasPlan ? ', and the exercises below are off the club’s training sheet' : ''}.`
          : `The club has no agreement from you on record for ${name} to take part, so ${name} is not screened.`}
      </Text>
      <Link href={`/athletes/${athlete.id}`} style={styles.consentLink} testID="family-consent-link">
        <Text variant="label">{`Change this on ${name}'s page →`}</Text>
      </Link>
    </Notice>
  );
}

function Summary({ summary, releasedAt, updatedAt }: { summary: FamilySummary; releasedAt: string; updatedAt: string | null }) {
  return (
    <Card testID="family-summary">
      <Text variant="small" testID="family-shared">
        Screen of {formatDate(summary.screenedOn)} · shared with you {formatDate(releasedAt)}
        {updatedAt ? ` · updated ${formatDate(updatedAt)} after the physiotherapist's decision` : ''}
      </Text>
      <Section title="What was checked" items={summary.checked} />
      <Section title="What we saw" items={summary.seen} />
      <Text variant="label">When is the next check?</Text>
      <Text testID="family-recheck">{recheckWords(summary.recheckDate, todayIso())}</Text>
      <Text variant="label">Who to ask</Text>
      <Text>{summary.contact}</Text>
      <Notice tone="caution" title="Please note">
        <View style={styles.list}>
          {summary.cautions.map((c) => (
            <Text key={c}>{c}</Text>
          ))}
        </View>
      </Notice>
    </Card>
  );
}

/** The last two released checks compared, in plain words (no angles or measurements). */
function Comparison({ comparison }: { comparison: FamilyComparison }) {
  return (
    <Card testID="family-comparison">
      <Text variant="heading">Since the check before</Text>
      <Text variant="small">
        {formatDate(comparison.earlierScreenedOn)} and {formatDate(comparison.laterScreenedOn)}
      </Text>
      <View style={styles.list}>
        {comparison.lines.map((line) => (
          <Text key={line}>{line}</Text>
        ))}
      </View>
    </Card>
  );
}

function Plan({ summary, sessions }: { summary: FamilySummary; sessions: FamilyViewData['sessionsSinceLatest'] }) {
  // Only beside a plan with exercises (our choice): with nothing extra to work on, the count says nothing
  // to a family.
  const done = summary.exercises.length ? sessionsSinceWords(summary.athleteFirstName, summary.screenedOn, sessions) : null;
  return (
    <Card testID="family-plan">
      <Text variant="heading">{`What ${summary.athleteFirstName} will work on`}</Text>
      <Text>{summary.howOften}</Text>
      {summary.exercises.length ? (
        <Text variant="small" testID="family-sets-words">
          A “rep” is one movement; a “set” is a run of reps done in a row, with a rest before the next set.
        </Text>
      ) : null}
      {done ? <Text testID="family-sessions">{done}</Text> : null}
      {summary.pain ? (
        <Notice tone="error" title="Something hurt" testID="family-pain">
          {summary.pain}
        </Notice>
      ) : null}
      {summary.onHold ? (
        <Notice tone="error" title="On hold for now">
          {summary.onHold}
        </Notice>
      ) : null}
      {summary.exercises.map((e) => (
        <View key={e.name} style={styles.exercise} testID="family-exercise">
          {/* Above its description in size too: the name is what a parent scans the list for. */}
          <Text variant="label" style={styles.exerciseName} accessibilityRole="header" aria-level={3}>
            {e.name}
          </Text>
          <Text variant="small">
            {e.howMuch} · {e.howOften}
          </Text>
          {e.clubOnly ? (
            <Text variant="small" style={styles.clubOnly} testID="family-club-only">
              {CLUB_ONLY_WORDS}
            </Text>
          ) : null}
          <Text>{e.purpose}</Text>
          {e.forWhat ? (
            <Text variant="small" testID="family-exercise-for">
              {e.forWhat}
            </Text>
          ) : null}
          <View style={styles.list}>
            {e.howTo.map((step, i) => (
              <Text key={step}>{`${i + 1}. ${step}`}</Text>
            ))}
          </View>
          <Text variant="small">Tip: {e.cue}</Text>
        </View>
      ))}
    </Card>
  );
}

function Section({ title, items }: { title: string; items: string[] }) {
  return (
    <View style={styles.list}>
      <Text variant="label">{title}</Text>
      {items.map((i) => (
        <Text key={i}>• {i}</Text>
      ))}
    </View>
  );
}

function Earlier({ releases }: { releases: SummaryRelease[] }) {
  return (
    <Card testID="family-earlier">
      <Text variant="heading">Earlier summaries</Text>
      {releases.map((r) => (
        <View key={r.id} style={styles.list}>
          {/* Each earlier screen once, as it was last shared. */}
          <Text variant="label">
            Screen of {formatDate(r.summary.screenedOn)} · as shared {formatDate(r.releasedAt)}
          </Text>
          {r.summary.seen.map((s) => (
            <Text key={s} variant="small">
              • {s}
            </Text>
          ))}
        </View>
      ))}
    </Card>
  );
}

const styles = StyleSheet.create({
  banner: { gap: space.xs, alignItems: 'flex-start' },
  exerciseName: { fontSize: 18, lineHeight: 24 },
  consentLink: { minHeight: 48, justifyContent: 'center', paddingVertical: space.sm },
  clubOnly: { fontFamily: fonts.bold, color: colors.amber },
  wrap: { gap: space.lg },
  columns: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { flex: 1 },
  list: { gap: space.xs },
  exercise: { gap: space.xs, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md },
  note: { gap: 2, borderLeftWidth: 4, borderLeftColor: colors.pine, paddingLeft: space.md },
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  photo: { width: 120, height: 160, borderRadius: radius.sm, backgroundColor: colors.line },
});
