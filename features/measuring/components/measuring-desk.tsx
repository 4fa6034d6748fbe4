import { Link, Redirect } from 'expo-router';
import { Fragment, useEffect, useMemo, useRef, useState } from 'react';
import { Platform, Pressable, StyleSheet, View } from 'react-native';
import { messageOf } from '@/features/api/client';
import { useMeasureQueueQuery } from '@/features/measuring/api/get-queue';
import { useSaveLandmarksMutation } from '@/features/measuring/api/save-landmarks';
import type { MeasureItem } from '@/features/measuring/contract';
import { refusalWords } from '@/features/measuring/refusal-words';
import { LazyLandmarkEditor } from '@/features/screening/components/landmarks/lazy-landmark-editor';
import type { LandmarkSet } from '@/features/screening/contract';
import { getTask } from '@/features/screening/engine/battery';
import { can } from '@/features/access/permissions';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { formatDate } from '@/features/ui/format-date';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { scrollToId } from '@/features/ui/scroll-to';
import { colors, radius, space, TOUCH_MIN } from '@/features/ui/theme';

const VIEW_WORD = { front: 'front', side: 'side' } as const;

function itemTitle(i: MeasureItem): string {
  return `${getTask(i.taskId).title}, ${VIEW_WORD[i.view]} photo`;
}

/**
 * The desk side of a screening: every photo taken courtside whose points are not all placed yet, one
 * after another. On a wide screen with a keyboard: N/P move between points, Z undoes, 1-3 zoom, Enter
 * saves and opens the next photo, the arrow keys move between photos without saving.
 */
export function MeasuringDesk({ roundId }: { roundId?: string }) {
  const { membership } = useActiveClub();
  if (!can(membership.role, 'screening.write')) return <Redirect href="/" />;
  return <Desk roundId={roundId} />;
}

const CURRENT_ANCHOR = 'measure-current';
const ERROR_ANCHOR = 'measure-error';

const PASSED_KEY = 'squadline.measure.passed';
function readPassed(): Set<string> {
  try {
    const kept: unknown = JSON.parse(globalThis.sessionStorage?.getItem(PASSED_KEY) ?? '[]');
    return new Set(Array.isArray(kept) ? kept.filter((x): x is string => typeof x === 'string') : []);
  } catch {
    return new Set();
  }
}
function keepPassed(ids: Set<string>): void {
  try {
    globalThis.sessionStorage?.setItem(PASSED_KEY, JSON.stringify([...ids].slice(-500)));
  } catch {
    // No storage: the skips last for this visit only.
  }
}

function Desk({ roundId }: { roundId?: string }) {
  const { isWide } = useBreakpoints();
  const query = useMeasureQueueQuery({ roundId });
  const save = useSaveLandmarksMutation();
  const items = useMemo(() => query.data?.items ?? [], [query.data]);
  const [currentId, setCurrentId] = useState<string | null>(null);
  const [marks, setMarks] = useState<LandmarkSet>({});
  const [error, setError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  // Every photo of the list moved past in this visit: said, with a way to go round again (the last photo's
  // Skip and an empty Save did nothing, as if the buttons were dead).
  const [roundDone, setRoundDone] = useState(false);
  // Points placed and not saved yet, per photo: moving to another photo (a skip, an arrow key, the list)
  // and back finds them again instead of the saved ones (they were dropped without a word).
  const drafts = useRef(new Map<string, LandmarkSet>());
  // Photos moved past in this visit (skipped, or saved with points still missing): the list goes on after
  // them, and a reload of the tab starts after them too (kept for the tab's life; a skipped photo came first
  // again after a reload).
  const passed = useRef<Set<string>>(readPassed());
  const pass = (id: string) => {
    passed.current.add(id);
    keepPassed(passed.current);
  };

  const shownAt = items.findIndex((i) => i.photo.id === currentId);
  const firstNotPassed = items.findIndex((i) => !passed.current.has(i.photo.id));
  const index = Math.max(0, shownAt !== -1 ? shownAt : currentId === null ? firstNotPassed : 0);
  const current: MeasureItem | undefined = items[index];

  // Start on the first photo, and keep the points in step with the photo shown.
  useEffect(() => {
    if (!current) return;
    if (current.photo.id !== currentId) setCurrentId(current.photo.id);
  }, [current, currentId]);
  const shownId = current?.photo.id;
  const firstShown = useRef<string | undefined>(undefined);
  useEffect(() => {
    setMarks((shownId ? drafts.current.get(shownId) : undefined) ?? current?.landmarks ?? {});
    setError(null);
    // Another photo after a save or a skip: back to its name and the saved notice, not left at the bottom
    // of the page where the buttons were (web; the first photo opens where the page starts).
    if (firstShown.current === undefined) firstShown.current = shownId;
    else if (shownId) scrollToId(CURRENT_ANCHOR);
    // Only when another photo is shown: a refetch must not wipe points being placed.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [shownId]);

  const goTo = (i: number) => {
    const target = items[(i + items.length) % Math.max(items.length, 1)];
    if (target) setCurrentId(target.photo.id);
  };

  const followingOf = (id: string): string | null => {
    const at = items.findIndex((i) => i.photo.id === id);
    const rest = [...items.slice(at + 1), ...items.slice(0, at)];
    return rest.find((i) => !passed.current.has(i.photo.id))?.photo.id ?? null;
  };

  const saveAndNext = async () => {
    if (!current || save.isPending) return;
    const id = current.photo.id;
    setError(null);
    setSaved(null);
    try {
      if (Object.keys(marks).length > 0) {
        const res = await save.mutateAsync({ photoId: id, landmarks: marks });
        drafts.current.delete(id);
        const placed = Object.values(marks).filter(Boolean).length;
        const needed = getTask(current.taskId).views.find((v) => v.view === current.view)?.landmarks.length ?? placed;
        setSaved(
          res.resultVersion
            ? `Saved. ${current.athlete.firstName}'s result was worked out again (version ${res.resultVersion}).`
            : placed < needed
              ? `Saved ${placed} of ${needed} points for ${current.athlete.firstName}: the result is worked out again once all are placed.`
              : `Saved for ${current.athlete.firstName}.`,
        );
      } else {
        setSaved(`No point placed on ${current.athlete.firstName}'s ${itemTitle(current).toLowerCase()}: it stays in the list to measure.`);
      }
      pass(id);
      const following = followingOf(id);
      if (following === null) setRoundDone(true);
      else setCurrentId(following);
    } catch (e) {
      setError(refusalWords(messageOf(e)));
    }
  };

  const skip = (by: 1 | -1) => {
    if (!current) return;
    pass(current.photo.id);
    setSaved(
      drafts.current.has(current.photo.id)
        ? `Not saved: the points placed on ${current.athlete.firstName}'s ${itemTitle(current).toLowerCase()} wait on this page until you come back to it.`
        : null,
    );
    if (by === 1 && followingOf(current.photo.id) === null) setRoundDone(true);
    else goTo(index + by);
  };

  const goRoundAgain = () => {
    passed.current.clear();
    keepPassed(passed.current);
    setRoundDone(false);
    setSaved(null);
    setCurrentId(items[0]?.photo.id ?? null);
  };

  // A refused save said where the eyes are: on a wide screen the buttons (and the notice by them) can sit
  // below the fold.
  useEffect(() => {
    if (error && isWide) scrollToId(ERROR_ANCHOR, true);
  }, [error, isWide]);

  // Desk keys: Enter saves and moves on; arrows move between photos. The editor handles its own keys.
  const deskKeys = useRef<(e: KeyboardEvent) => void>(() => undefined);
  deskKeys.current = (e: KeyboardEvent) => {
    const el = e.target as { tagName?: string } | null;
    if (el?.tagName === 'INPUT' || el?.tagName === 'TEXTAREA' || e.altKey || e.ctrlKey || e.metaKey) return;
    if (e.key === 'Enter' && el?.tagName !== 'BUTTON' && (el as { getAttribute?: (n: string) => string | null })?.getAttribute?.('role') !== 'button') {
      e.preventDefault();
      void saveAndNext();
    } else if (e.key === 'ArrowRight') {
      e.preventDefault();
      skip(1);
    } else if (e.key === 'ArrowLeft') {
      e.preventDefault();
      skip(-1);
    }
  };
  useEffect(() => {
    const target = globalThis as unknown as Partial<Pick<Window, 'addEventListener' | 'removeEventListener'>>;
    if (Platform.OS !== 'web' || !target.addEventListener) return;
    const listener = (e: KeyboardEvent) => deskKeys.current(e);
    target.addEventListener('keydown', listener);
    return () => target.removeEventListener?.('keydown', listener);
  }, []);

  if (query.error) return <Notice tone="error">{messageOf(query.error)}</Notice>;
  if (!query.data) return <Text>Loading the photos to measure…</Text>;

  const header = (
    <View style={styles.header}>
      <Text variant="title" accessibilityRole="header">
        To measure
      </Text>
      <Text testID="measure-count">
        {items.length === 0
          ? 'Every photo has its points.'
          : `${items.length} ${items.length === 1 ? 'photo is waiting for its' : 'photos are waiting for their'} points${roundId ? ' in this round' : ' across the club'}.`}
      </Text>
    </View>
  );

  if (current && roundDone) {
    return (
      <View style={styles.wrap}>
        {header}
        {saved ? <Notice testID="measure-saved">{saved}</Notice> : null}
        <Notice title="End of the list" testID="measure-round-done">
          {`You have been through every photo. ${items.length} ${items.length === 1 ? 'still waits' : 'still wait'} for ${items.length === 1 ? 'its' : 'their'} points: skipped, or saved with points missing.`}
        </Notice>
        <View style={styles.actions}>
          <Button label="Go through them again" testID="measure-again" onPress={goRoundAgain} style={styles.primary} />
        </View>
        <Link href={roundId ? `/screening/rounds/${roundId}` : '/screening'} style={styles.link}>
          <Text style={styles.linkText}>{roundId ? '← Back to the round' : '← Screening rounds'}</Text>
        </Link>
      </View>
    );
  }

  if (!current) {
    return (
      <View style={styles.wrap}>
        {header}
        {saved ? <Notice testID="measure-saved">{saved}</Notice> : null}
        <Notice title="Nothing left to measure" testID="measure-empty">
          Photos taken courtside without points appear here. Once their points are placed, submitted results are worked out again.
        </Notice>
        <Link href="/screening" style={styles.link}>
          <Text style={styles.linkText}>← Screening rounds</Text>
        </Link>
      </View>
    );
  }

  const list = (
    <View style={styles.list} accessibilityRole="list" testID="measure-list">
      {items.map((i, n) => {
        const on = i.photo.id === current.photo.id;
        // The queue runs newest round first: each round's photos under its name, squad and day.
        const roundHead =
          n === 0 || items[n - 1]!.round.id !== i.round.id ? (
            <Text variant="small" style={styles.roundHead} testID={`measure-round-${i.round.id}`}>
              {`${i.round.name} · ${i.round.squadName} · ${formatDate(i.round.screenedOn)}`}
            </Text>
          ) : null;
        return (
          <Fragment key={i.photo.id}>
            {roundHead}
            <Pressable
              accessibilityRole="button"
              aria-current={on}
              testID={`measure-item-${i.photo.id}`}
              onPress={() => goTo(n)}
              style={[styles.item, on && styles.itemOn]}
            >
              <Text variant="label">{`${i.athlete.firstName} ${i.athlete.lastName}`}</Text>
              <Text variant="small">{`${itemTitle(i)} · ${i.placed} of ${i.needed} points`}</Text>
            </Pressable>
          </Fragment>
        );
      })}
    </View>
  );

  return (
    <View style={styles.wrap}>
      {header}
      <View style={[styles.columns, isWide && styles.columnsWide]}>
        {isWide ? <View style={styles.side}>{list}</View> : null}
        <View style={styles.main}>
          <View style={styles.current} testID="measure-current" nativeID={CURRENT_ANCHOR}>
            <Text variant="heading">{`${current.athlete.firstName} ${current.athlete.lastName}`}</Text>
            <Text>{`${itemTitle(current)} · ${current.round.name} (${current.round.squadName})`}</Text>
            <Text variant="small" testID="measure-position">{`Photo ${index + 1} of ${items.length}`}</Text>
            {isWide ? <Text variant="small">Enter saves and opens the next photo · ← → move between photos without saving</Text> : null}
          </View>
          {saved ? <Notice testID="measure-saved">{saved}</Notice> : null}
          <LazyLandmarkEditor
            key={current.photo.id}
            task={getTask(current.taskId)}
            view={current.view}
            photo={current.photo}
            value={drafts.current.get(current.photo.id) ?? current.landmarks}
            racketHand={current.athlete.racketHand}
            onChange={(next) => {
              setMarks(next);
              // Kept only when it differs from what is saved (the editor reports its first value too).
              if (JSON.stringify(next) !== JSON.stringify(current.landmarks ?? {})) drafts.current.set(current.photo.id, next);
              else drafts.current.delete(current.photo.id);
            }}
            shortcuts={isWide}
          />
          {/* Kept in sight at the bottom of the window at every width: at 1440x900 the photo ran below the
              fold and the button with it. */}
          <View style={[styles.actions, Platform.OS === 'web' && styles.actionsPinned]}>
            {/* Beside the button that was pressed: at the top of the page it was out of sight on a phone. */}
            {error ? (
              <View style={styles.errorRow} nativeID={ERROR_ANCHOR}>
                <Notice tone="error" title="Not saved" testID="measure-error">
                  {`${error} The points are kept here: adjust them and save again.`}
                </Notice>
              </View>
            ) : null}
            <Button
              label={isWide ? 'Save, next photo (Enter)' : 'Save, next photo'}
              testID="measure-save-next"
              busy={save.isPending}
              onPress={() => void saveAndNext()}
              style={styles.primary}
            />
            <Button tone="secondary" label={isWide ? 'Skip (→)' : 'Skip'} testID="measure-skip" onPress={() => skip(1)} />
          </View>
        </View>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  errorRow: { flexBasis: '100%' },
  wrap: { gap: space.lg },
  header: { gap: space.xs },
  columns: { gap: space.lg },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  side: { width: 260, maxHeight: 760, overflow: 'scroll' as 'hidden' },
  main: { flex: 1, gap: space.md },
  current: { gap: 2 },
  list: { gap: space.xs },
  roundHead: { marginTop: space.sm, fontWeight: '600', color: colors.inkMuted },
  item: { minHeight: TOUCH_MIN, padding: space.sm, borderRadius: radius.md, borderWidth: 2, borderColor: colors.line, backgroundColor: colors.surface, gap: 2 },
  itemOn: { borderColor: colors.pine, backgroundColor: colors.pineSoft },
  actions: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
  // On a phone the points list runs below the photo: saving stays one tap away at the foot of the screen
  // (web-only style keys).
  actionsPinned: { position: 'sticky', bottom: 0, zIndex: 3, backgroundColor: colors.paper, paddingVertical: space.sm } as object,
  primary: { flexGrow: 1 },
  link: { minHeight: TOUCH_MIN, justifyContent: 'center' },
  linkText: { color: colors.pine },
});
