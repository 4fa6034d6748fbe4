import { AthleteClearanceBadge } from '@/features/care/components/clearance-badge';
import { can } from '@/features/access/permissions';
import { Link } from 'expo-router';
import { useDeferredValue, useState, useSyncExternalStore } from 'react';
import { StyleSheet, View } from 'react-native';
import { useAddNewcomersMutation, useSetRoundClosedMutation } from '@/features/screening/api/close-round';
import { loadedDevice, useOutboxState } from '@/features/offline/device-handle';
import { useRoundQuery } from '@/features/screening/api/get-round';
import { useKeepRoundOnDevice } from '@/features/screening/hooks/use-keep-round';
import { useActiveClub } from '@/features/session/active-club';
import type { RoundAthlete, RoundAthleteFlag, RoundDetail } from '@/features/screening/contract';
import { messageOf } from '@/features/api/client';
import { Button } from '@/features/ui/components/button';
import { usePageTitle } from '@/features/ui/page-title';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { RoundProgress } from './round-progress';
import { PlainTag, SeverityTag, StatusTag } from './status-tag';
import { formatDate } from '@/features/ui/format-date';
import { closedLine, staleRoundLine } from '@/features/screening/round-lines';
import { todayIso } from '@/features/athletes/age';
import { assessmentHref } from '@/features/screening/assessment-href';
import { PAGE_HEADS } from '@/features/shell/page-heads';
import { frameStyles } from '@/features/shell/components/shell-frame';
import { TAKING_PART_TAGS, TAKING_PART_WORDS } from '@/features/athletes/taking-part';

const byName = (a: RoundAthlete, b: RoundAthlete) => a.lastName.localeCompare(b.lastName) || a.firstName.localeCompare(b.firstName);

/**
 * An athlete's flags at a glance: how many of each severity, then their names, most severe first. Counted
 * as the result page shows them: one per pattern (its title) and side, at its most severe.
 */
function AthleteFlags({ flags, testID }: { flags: RoundAthleteFlag[]; testID: string }) {
  if (flags.length === 0) return <PlainTag tone="info" label="No flags" />;
  const groups = new Map<string, RoundAthleteFlag['severity']>();
  for (const f of flags) {
    const name = f.side === 'left' || f.side === 'right' ? `${f.title} (${f.side})` : f.side === 'both' ? `${f.title} (both sides)` : f.title;
    if (groups.get(name) !== 'concern') groups.set(name, f.severity);
  }
  const concern = [...groups.values()].filter((s) => s === 'concern');
  const watch = [...groups.values()].filter((s) => s === 'watch');
  const shown = [...groups.keys()];
  return (
    <View style={styles.flags} testID={testID}>
      <View style={styles.tags}>
        {concern.length > 0 ? <SeverityTag severity="concern" count={concern.length} /> : null}
        {watch.length > 0 ? <SeverityTag severity="watch" count={watch.length} /> : null}
      </View>
      <Text variant="small" numberOfLines={2}>
        {shown.slice(0, 3).join(' · ')}
        {shown.length > 3 ? ` · and ${shown.length - 3} more` : ''}
      </Text>
    </View>
  );
}

/**
 * Who is not screened in this round and why: the family said no (nothing to do), or no decision is
 * recorded yet (those who record consent get a link to each athlete's page to record it).
 */
function NotToScreen({ athletes }: { athletes: RoundAthlete[] }) {
  const records = can(useActiveClub().membership.role, 'consent.manage');
  const refused = athletes.filter((a) => a.screeningRefused);
  const unrecorded = athletes.filter((a) => !a.screeningRefused);
  const names = (list: RoundAthlete[]) => list.map((a) => `${a.firstName} ${a.lastName}`).join(', ');
  return (
    <Notice tone="caution" title="Not to be screened" testID="round-not-taking-part">
      {refused.length ? <Text>{`${names(refused)}: ${TAKING_PART_WORDS.refused}. Leave ${refused.length === 1 ? 'them' : 'them all'} out.`}</Text> : null}
      {unrecorded.length ? (
        <Text>{`${names(unrecorded)}: ${TAKING_PART_WORDS.unrecorded}. ${
          records ? 'Record it on the athlete’s page, then screen.' : 'A head coach or the admin records it on the athlete’s page.'
        }`}</Text>
      ) : null}
      {records
        ? unrecorded.map((a) => (
            <Link key={a.athleteId} href={`/athletes/${a.athleteId}`} style={styles.consentLink} testID={`round-record-consent-${a.athleteId}`}>
              <Text variant="label" style={styles.consentLinkText}>{`Record ${a.firstName}'s consent →`}</Text>
            </Link>
          ))
        : null}
    </Notice>
  );
}

/** Close (the roles that screen) or reopen (the head coach). */
function RoundClosing({ id, closed, unfinished }: { id: string; closed: boolean; unfinished: number }) {
  const { role } = useActiveClub().membership;
  const mutation = useSetRoundClosedMutation(id);
  const [confirming, setConfirming] = useState(false);
  if (closed && role !== 'head_coach') return null;
  if (!closed && !can(role, 'screening.write')) return null;
  if (!closed && !confirming) {
    return <Button tone="secondary" label="Close this round" testID="round-close" onPress={() => setConfirming(true)} style={styles.closeButton} />;
  }
  return (
    <View style={styles.closing}>
      {!closed ? (
        <Text>
          {`Close the round? Its screens can then be read but not changed, until a head coach reopens it.${
            unfinished > 0 ? ` ${unfinished === 1 ? '1 athlete is' : `${unfinished} athletes are`} not submitted yet and will stay that way.` : ''
          }`}
        </Text>
      ) : null}
      <View style={styles.closingButtons}>
        <Button
          tone={closed ? 'secondary' : 'danger'}
          label={closed ? 'Reopen this round' : 'Yes, close it'}
          testID={closed ? 'round-reopen' : 'round-close-confirm'}
          busy={mutation.isPending}
          onPress={() => mutation.mutate(!closed, { onSuccess: () => setConfirming(false) })}
        />
        {!closed ? <Button tone="quiet" label="Keep it open" onPress={() => setConfirming(false)} /> : null}
      </View>
      {mutation.error ? <Notice tone="error">{messageOf(mutation.error)}</Notice> : null}
    </View>
  );
}

/** One round: its athletes with their progress, big rows to tap, and the next athlete to screen. */
/** Athletes who joined the squad after the round began: named, and brought in with one tap. */
function Newcomers({
  roundId,
  squadName,
  screenedOn,
  newcomers,
}: {
  roundId: string;
  squadName: string;
  screenedOn: string;
  newcomers: NonNullable<RoundDetail['newcomers']>;
}) {
  const add = useAddNewcomersMutation(roundId);
  const names = newcomers.map((a) => `${a.firstName} ${a.lastName}`).join(', ');
  return (
    <Notice title={`New in ${squadName} since this round began`} testID="round-newcomers">
      <Text>{`${names}: not in this round yet. Their screens would carry the round's day (${formatDate(screenedOn)}); screened on a later day, they belong in a new round.`}</Text>
      {add.error ? <Text role="alert">{add.error.message}</Text> : null}
      <Button
        tone="secondary"
        label={newcomers.length === 1 ? `Add ${newcomers[0]!.firstName} to this round` : `Add these ${newcomers.length} to this round`}
        busy={add.isPending}
        onPress={() => add.mutate()}
        testID="round-add-newcomers"
      />
    </Notice>
  );
}

export function RoundScreen({ id }: { id: string }) {
  const round = useRoundQuery(id);
  // Drawn in the background when the round arrives (as the round list and the homes are): drawn at
  // once, the rows of every athlete were one long render at the end of the page's start.
  const data = useDeferredValue(round.data);
  const { isTabletUp } = useBreakpoints();
  const screensInClub = can(useActiveClub().membership.role, 'screening.write');
  usePageTitle(data ? data.round.name : 'Round');
  useKeepRoundOnDevice(data);
  // Submits made on this phone and not sent yet: the athlete is done here, the server has not heard.
  const queue = useOutboxState();
  const sentAfterWaiting = useSentAfterWaiting();
  const waitingSubmit = new Set(queue.entries.flatMap((e) => (e.kind === 'submit' ? [e.assessmentId] : [])));
  // The back link and the head are drawn from the first render, where the pre-rendered frame has them
  // (PAGE_HEADS.round in features/shell/page-heads.ts), so nothing moves when the round arrives.
  const head = (
    <>
      <Link href="/screening" style={frameStyles.frameBack}>
        <Text variant="label" style={frameStyles.frameBackText}>
          {PAGE_HEADS.round.back}
        </Text>
      </Link>
      <View style={styles.head}>
        <Text variant="small">{data ? `${data.round.squadName} · ${formatDate(data.round.screenedOn)}` : '\u00a0'}</Text>
        <Text variant="title" accessibilityRole="header">
          {data ? data.round.name : PAGE_HEADS.round.title}
        </Text>
        <Text>{PAGE_HEADS.round.text}</Text>
        {data ? (
          <RoundProgress
            round={data.round}
            waiting={data.athletes.filter((a) => waitingSubmit.has(a.assessmentId) && a.status !== 'submitted').map((a) => a.status)}
          />
        ) : null}
      </View>
    </>
  );
  if (!data || round.error) {
    return (
      <View style={styles.wrap}>
        {head}
        {round.error ? <Notice tone="error">{round.error.message}</Notice> : <Text>Loading the round…</Text>}
      </View>
    );
  }
  const { round: r, athletes } = data;
  const closed = r.closedAt !== null;
  // A closed round is read: every row opens the result.
  const screens = screensInClub && !closed;
  const sorted = athletes
    .map((a) =>
      waitingSubmit.has(a.assessmentId) && a.status !== 'submitted' ? { ...a, status: 'submitted' as const, waiting: true } : { ...a, waiting: false },
    )
    .sort(byName);
  // Nobody is screened without the family's agreement on record: such athletes are never "next".
  const screenable = sorted.filter((a) => a.screeningConsent);
  const next = screens ? (screenable.find((a) => a.status === 'in_progress') ?? screenable.find((a) => a.status === 'not_started')) : undefined;
  const notTakingPart = athletes.filter((a) => !a.screeningConsent && a.status !== 'submitted');
  const sentHere = athletes.filter((a) => sentAfterWaiting.includes(a.assessmentId));
  return (
    <View style={styles.wrap}>
      {head}
      {sentHere.length > 0 ? (
        <Notice title="Sent from this phone" testID="round-sent">
          <Text>
            {`${sentHere.map((a) => `${a.firstName} ${a.lastName}`).join(', ')}: ${sentHere.length === 1 ? 'the screen that waited on this phone is' : 'the screens that waited on this phone are'} on the server now, with ${sentHere.length === 1 ? 'its result' : 'their results'} below.`}
          </Text>
          <Button
            tone="quiet"
            label="Got it"
            onPress={() => loadedDevice()?.sentSubmits.forget(sentHere.map((a) => a.assessmentId))}
            testID="round-sent-close"
          />
        </Notice>
      ) : null}
      {closed ? (
        <Notice title="This round is closed" testID="round-closed">
          {closedLine(r.closedAt!, r.closedByName)}
        </Notice>
      ) : screensInClub && staleRoundLine(r.screenedOn, todayIso()) ? (
        <Notice tone="caution" testID="round-stale">
          {staleRoundLine(r.screenedOn, todayIso())}
        </Notice>
      ) : null}
      {screensInClub ? (
        <Link href={`/measuring?roundId=${r.id}`} style={frameStyles.frameBack} testID="round-measure">
          <Text variant="label" style={frameStyles.frameBackText}>
            Place the points of this round&apos;s photos →
          </Text>
        </Link>
      ) : null}
      {closed ? null : next ? (
        <Link href={assessmentHref(next)} style={styles.next} testID="screen-next">
          <View style={styles.nextInner}>
            <Text style={styles.nextLabel}>{next.status === 'in_progress' ? 'Continue screening' : 'Screen next'}</Text>
            <Text style={styles.nextName}>
              {next.firstName} {next.lastName} →
            </Text>
          </View>
        </Link>
      ) : r.counts.submitted === athletes.length || (screens && screenable.length > 0) ? (
        <Notice title="Everyone is screened">
          {notTakingPart.length > 0 ? 'Every athlete of this round who may be screened has been submitted.' : 'Every athlete of this round has been submitted.'}
        </Notice>
      ) : null}
      {screens && data.newcomers?.length ? <Newcomers roundId={r.id} squadName={r.squadName} screenedOn={r.screenedOn} newcomers={data.newcomers} /> : null}
      {notTakingPart.length > 0 && screensInClub ? <NotToScreen athletes={notTakingPart} /> : null}
      <Card style={styles.list}>
        <Text variant="heading">Athletes ({athletes.length})</Text>
        <View style={isTabletUp ? styles.grid : undefined}>
          {sorted.map((a) => (
            <Link
              key={a.assessmentId}
              href={assessmentHref(a.waiting ? { ...a, status: 'in_progress' } : a, screens)}
              style={[styles.row, isTabletUp && styles.rowGrid]}
              testID={`round-athlete-${a.athleteId}`}
              accessibilityLabel={`${a.firstName} ${a.lastName}, ${a.status.replace('_', ' ')}${a.screeningConsent ? '' : `, ${TAKING_PART_TAGS[a.screeningRefused ? 'refused' : 'unrecorded']}`}${a.photoConsent ? '' : ', no photo consent'}`}
            >
              <View style={styles.rowInner}>
                <View style={styles.rowMain}>
                  <Text variant="label" style={styles.name}>
                    {a.firstName} {a.lastName}
                  </Text>
                  <View style={styles.tags}>
                    {a.waiting ? (
                      <PlainTag tone="info" label="Submitted on this phone · waiting to send" />
                    ) : !a.screeningConsent && a.status !== 'submitted' ? null : (
                      <StatusTag status={a.status} />
                    )}
                    {!a.screeningConsent ? <PlainTag label={`${TAKING_PART_TAGS[a.screeningRefused ? 'refused' : 'unrecorded']}: do not screen`} /> : null}
                    {!a.photoConsent && a.screeningConsent ? <PlainTag label="No photo consent" /> : null}
                    <AthleteClearanceBadge athleteId={a.athleteId} />
                  </View>
                  {/* A submit still on this phone has no result yet: no flag count (it read "No flags"). */}
                  {a.status === 'submitted' && !a.waiting ? <AthleteFlags flags={a.flags} testID={`round-flags-${a.athleteId}`} /> : null}
                </View>
                <Text style={styles.chevron}>›</Text>
              </View>
            </Link>
          ))}
        </View>
      </Card>
      <RoundClosing id={r.id} closed={closed} unfinished={athletes.filter((a) => a.screeningConsent && a.status !== 'submitted').length} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  head: { gap: space.xs },
  next: { backgroundColor: colors.pine, borderRadius: radius.lg, padding: space.lg, minHeight: TOUCH_MIN + 24 },
  nextInner: { gap: 2 },
  nextLabel: { color: '#fff', fontFamily: fonts.regular, fontSize: 16 },
  nextName: { color: '#fff', fontFamily: fonts.bold, fontSize: 22, lineHeight: 28 },
  list: { gap: space.sm },
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
  row: { minHeight: TOUCH_MIN + 20, borderTopWidth: 1, borderTopColor: colors.line, paddingVertical: space.md },
  rowGrid: { flexBasis: 320, flexGrow: 1 },
  rowInner: { flexDirection: 'row', alignItems: 'center', gap: space.md, width: '100%' },
  rowMain: { flex: 1, gap: space.xs },
  name: { fontSize: 18 },
  tags: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  flags: { gap: 2 },
  closing: { gap: space.sm },
  consentLink: { minHeight: TOUCH_MIN, justifyContent: 'center' },
  consentLinkText: { color: colors.pine },
  closeButton: { alignSelf: 'flex-start' },
  closingButtons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chevron: { fontFamily: fonts.bold, fontSize: 28, color: colors.inkMuted },
});

const NOTHING: readonly string[] = [];
const noSubscription = () => () => undefined;

/** Submits of this phone that waited (no connection) and have since reached the server (features/offline). */
function useSentAfterWaiting(): readonly string[] {
  const device = loadedDevice();
  return useSyncExternalStore(device ? device.sentSubmits.subscribe : noSubscription, device ? device.sentSubmits.ids : () => NOTHING);
}
