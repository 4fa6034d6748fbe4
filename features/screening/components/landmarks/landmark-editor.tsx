import { useEffect, useMemo, useRef, useState } from 'react';
import { Platform, Pressable, StyleSheet, useWindowDimensions, View, type GestureResponderEvent, type LayoutChangeEvent } from 'react-native';
import { apiAssetUrl } from '@/features/api/client';
import { suggestibleIds } from '@/features/pose-suggestion/map-pose';
import { poseAvailable } from '@/features/pose-suggestion/run-pose';
import type { LandmarkPoint, LandmarkSet, PhotoView } from '@/features/screening/contract';
import { getLandmark } from '@/features/screening/engine/landmarks';
import type { LandmarkId, Point, Side, TaskSpec, View as PhotoSide } from '@/features/screening/engine';
import { overlayFor } from '@/features/screening/overlay/overlay';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { LazyPhotoOverlay } from './lazy-photo-overlay';
import type { ViewBox } from './photo-overlay';
import { useSuggestion } from './use-suggestion';

type Props = {
  task: TaskSpec;
  view: PhotoSide;
  photo: PhotoView;
  value: LandmarkSet;
  racketHand?: Side;
  onChange(next: LandmarkSet): void;
  /** Keyboard shortcuts on the web (a desk with a keyboard): N/P next/previous point, Z undo, 1-3 zoom. */
  shortcuts?: boolean;
};

/** Keys the editor answers to when `shortcuts` is on; the desk adds its own for moving between photos. */
export const EDITOR_SHORTCUTS: readonly { keys: string; what: string }[] = [
  { keys: 'N', what: 'next point' },
  { keys: 'P', what: 'previous point' },
  { keys: 'Z or Ctrl+Z', what: 'undo' },
  { keys: '1 2 3', what: 'zoom' },
  { keys: 'S', what: 'suggest points' },
  { keys: 'C', what: 'confirm suggested points' },
];

/** True when a key press is meant for a text field, not for the editor. */
function typingInField(target: EventTarget | null): boolean {
  const el = target as { tagName?: string; isContentEditable?: boolean } | null;
  return !!el && (el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable === true);
}

const ZOOMS = [1, 2, 3] as const;
type Zoom = (typeof ZOOMS)[number];
/** Screen pixels: a press this close to a point grabs it; a move this far turns a tap into a pan. */
const GRAB_RADIUS = 26;
const TAP_SLOP = 8;

type Gesture = {
  start: Point;
  origin: Point | null;
  mode: 'pending' | 'drag' | 'pan';
  dragId: LandmarkId | null;
  /** The point dragged is a suggestion not confirmed yet. */
  dragSuggested: boolean;
  startCenter: Point;
  before: LandmarkSet;
};

const clamp = (v: number, min: number, max: number) => Math.min(max, Math.max(min, v));

/** A confirmed point dragged somewhere else: a suggestion becomes "moved"; a point placed by hand stays "placed". */
function movedPoint(before: LandmarkPoint | undefined, to: Point): LandmarkPoint {
  const source = before?.source === 'suggested' || before?.source === 'moved' ? 'moved' : 'placed';
  return { ...to, source };
}

/**
 * Place the task's landmarks on a photo: tap places the next one, drag moves a point, 1x/2x/3x zoom with
 * panning for precision, undo and clear. Points are stored in the photo's pixels; the angles are the
 * engine's, live. Loaded lazily: only testers placing landmarks download it.
 */
export default function LandmarkEditor({ task, view, photo, value, racketHand, onChange, shortcuts = false }: Props) {
  const { isWide } = useBreakpoints();
  const window = useWindowDimensions();
  const needed = task.views.find((v) => v.view === view)?.landmarks ?? [];
  const [marks, setMarks] = useState<LandmarkSet>(value);
  const [history, setHistory] = useState<LandmarkSet[]>([]);
  const [selected, setSelected] = useState<LandmarkId | null>(null);
  const [zoom, setZoom] = useState<Zoom>(1);
  const [center, setCenter] = useState<Point>({ x: photo.width / 2, y: photo.height / 2 });
  const [columnWidth, setColumnWidth] = useState(0);
  const surface = useRef<View>(null);
  const gesture = useRef<Gesture | null>(null);

  const suggestion = useSuggestion({ photo, view, needed, racketHand, placed: marks });
  const suggested = suggestion.points;
  const canSuggest = poseAvailable && suggestibleIds(view, needed, racketHand).some((id) => !marks[id]);

  // The next tap places the first point neither placed nor waiting as a suggestion.
  const active: LandmarkId | null = selected ?? needed.find((id) => !marks[id] && !suggested[id]) ?? null;
  const suggestedCount = needed.filter((id) => suggested[id]).length;
  const placedCount = needed.filter((id) => marks[id]).length;
  const overlay = useMemo(() => overlayFor(task, view, marks, racketHand), [task, view, marks, racketHand]);

  // Fit the photo to the column, and keep a tall photo within what the header and the bottom bar leave.
  const maxHeight = window.height * (isWide ? 0.64 : 0.52);
  const displayWidth = Math.max(1, Math.min(columnWidth, (maxHeight * photo.width) / photo.height));
  const displayHeight = (displayWidth * photo.height) / photo.width;
  const vb: ViewBox = useMemo(() => {
    const width = photo.width / zoom;
    const height = photo.height / zoom;
    return {
      x: clamp(center.x - width / 2, 0, photo.width - width),
      y: clamp(center.y - height / 2, 0, photo.height - height),
      width,
      height,
    };
  }, [center, zoom, photo.width, photo.height]);
  const unit = vb.width / displayWidth;

  const commit = (next: LandmarkSet, before: LandmarkSet = marks) => {
    setHistory((h) => [...h.slice(-49), before]);
    setMarks(next);
    onChange(next);
  };

  const toPhoto = (g: Gesture, pageX: number, pageY: number): Point => ({
    x: clamp(vb.x + (pageX - g.origin!.x) * unit, 0, photo.width),
    y: clamp(vb.y + (pageY - g.origin!.y) * unit, 0, photo.height),
  });

  const measureOrigin = (g: Gesture) =>
    new Promise<void>((resolve) => {
      if (!surface.current) return resolve();
      surface.current.measureInWindow((x, y) => {
        g.origin = { x, y };
        resolve();
      });
    });

  // A tap always places the point named above; a press that moves starts dragging the nearest point
  // (or, zoomed in, pans the photo when no point is near).
  const onGrant = (e: GestureResponderEvent) => {
    const { pageX, pageY } = e.nativeEvent;
    const g: Gesture = { start: { x: pageX, y: pageY }, origin: null, mode: 'pending', dragId: null, dragSuggested: false, startCenter: center, before: marks };
    gesture.current = g;
    void measureOrigin(g).then(() => {
      if (!g.origin) return;
      const p = toPhoto(g, pageX, pageY);
      let best: { id: LandmarkId; d: number; suggested: boolean } | null = null;
      for (const id of needed) {
        const q = marks[id] ?? suggested[id];
        if (!q) continue;
        const d = Math.hypot(q.x - p.x, q.y - p.y) / unit;
        if (d <= GRAB_RADIUS && (!best || d < best.d)) best = { id, d, suggested: !marks[id] };
      }
      g.dragId = best?.id ?? null;
      g.dragSuggested = best?.suggested ?? false;
    });
  };

  const onMove = (e: GestureResponderEvent) => {
    const g = gesture.current;
    if (!g?.origin) return;
    const { pageX, pageY } = e.nativeEvent;
    const dx = pageX - g.start.x;
    const dy = pageY - g.start.y;
    if (g.mode === 'pending' && Math.hypot(dx, dy) > TAP_SLOP) {
      if (g.dragId) g.mode = 'drag';
      else if (zoom > 1) g.mode = 'pan';
    }
    if (g.mode === 'drag' && g.dragId) {
      const id = g.dragId;
      const p = toPhoto(g, pageX, pageY);
      if (g.dragSuggested) suggestion.move(id, p);
      else setMarks((m) => ({ ...m, [id]: movedPoint(m[id], p) }));
    } else if (g.mode === 'pan') {
      setCenter({ x: g.startCenter.x - dx * unit, y: g.startCenter.y - dy * unit });
    }
  };

  const onRelease = (e: GestureResponderEvent) => {
    const g = gesture.current;
    gesture.current = null;
    if (!g) return;
    const { pageX, pageY } = e.nativeEvent;
    void measureOrigin(g).then(() => {
      if (!g.origin) return;
      if (g.mode === 'drag' && g.dragId) {
        const p = toPhoto(g, pageX, pageY);
        if (g.dragSuggested) suggestion.move(g.dragId, p);
        else commit({ ...g.before, [g.dragId]: movedPoint(g.before[g.dragId], p) }, g.before);
        return;
      }
      if (g.mode !== 'pending' || Math.hypot(pageX - g.start.x, pageY - g.start.y) > TAP_SLOP) return;
      if (!active) return;
      // Placed by hand: a suggestion waiting for this point is dropped.
      suggestion.drop(active);
      commit({ ...marks, [active]: { ...toPhoto(g, pageX, pageY), source: 'placed' } });
      setSelected(null);
    });
  };

  const setZoomAround = (z: Zoom) => {
    const focus =
      (active && marks[active]) ??
      [...needed]
        .reverse()
        .map((id) => marks[id])
        .find(Boolean);
    if (z > zoom && focus) setCenter(focus);
    if (z === 1) setCenter({ x: photo.width / 2, y: photo.height / 2 });
    setZoom(z);
  };

  const undo = () => {
    const previous = history[history.length - 1];
    if (!previous) return;
    setHistory((h) => h.slice(0, -1));
    setMarks(previous);
    onChange(previous);
  };

  const activeSpec = active ? getLandmark(active) : null;

  /** Suggested points become placed points only here, each marked as suggested or moved. */
  const confirmSuggestion = () => {
    const taken = suggestion.take();
    if (Object.keys(taken).length === 0) return;
    commit({ ...marks, ...taken });
    setSelected(null);
  };

  // Keyboard: the handler reads the latest state through a ref, so the listener is added once.
  const step = (by: 1 | -1) => {
    if (needed.length === 0) return;
    const from = active ? needed.indexOf(active) : by === 1 ? -1 : needed.length;
    setSelected(needed[(from + by + needed.length) % needed.length] ?? null);
  };
  const keyHandler = useRef<(e: KeyboardEvent) => void>(() => undefined);
  keyHandler.current = (e: KeyboardEvent) => {
    if (typingInField(e.target) || e.altKey) return;
    const key = e.key.toLowerCase();
    if (key === 'z' && !e.shiftKey) undo();
    else if (e.ctrlKey || e.metaKey) return;
    else if (key === 'n') step(1);
    else if (key === 'p') step(-1);
    else if (key === '1' || key === '2' || key === '3') setZoomAround(Number(key) as Zoom);
    else if (key === 's' && canSuggest && !suggestion.busy) void suggestion.run();
    else if (key === 'c' && suggestedCount > 0) confirmSuggestion();
    else return;
    e.preventDefault();
  };
  useEffect(() => {
    const target = globalThis as unknown as Partial<Pick<Window, 'addEventListener' | 'removeEventListener'>>;
    if (!shortcuts || Platform.OS !== 'web' || !target.addEventListener) return;
    const listener = (e: KeyboardEvent) => keyHandler.current(e);
    target.addEventListener('keydown', listener);
    return () => target.removeEventListener?.('keydown', listener);
  }, [shortcuts]);

  return (
    <View style={styles.wrap} testID="landmark-editor">
      <View style={[styles.columns, isWide && styles.columnsWide]}>
        <View style={[styles.photoColumn, isWide && styles.photoColumnWide]} onLayout={(e: LayoutChangeEvent) => setColumnWidth(e.nativeEvent.layout.width)}>
          <View style={[styles.prompt, !isWide && Platform.OS === 'web' && styles.promptPinned]} testID="landmark-next" accessibilityLiveRegion="polite">
            {suggestedCount > 0 ? (
              <>
                <Text variant="label">{`Check the ${suggestedCount} suggested points`}</Text>
                <Text variant="small">
                  Hollow circles are suggestions from the photo. Drag any that is off, then confirm them: nothing is measured from a point until it is
                  confirmed.
                </Text>
                {activeSpec ? <Text variant="small">{`Still to place by hand: ${activeSpec.label}.`}</Text> : null}
              </>
            ) : activeSpec ? (
              <>
                <Text variant="label">
                  {selected ? 'Place again: ' : `Tap ${placedCount + 1} of ${needed.length}: `}
                  {activeSpec.label}
                </Text>
                <Text variant="small">{activeSpec.hint}</Text>
              </>
            ) : (
              <>
                <Text variant="label">All {needed.length} points placed</Text>
                <Text variant="small">Drag a point to adjust it, or pick one in the list to place it again.</Text>
              </>
            )}
            <Text variant="small" style={styles.orientation}>
              {view === 'front'
                ? "The athlete faces the camera: their right side is on the photo's left."
                : 'Side photo: the points of the side nearest the camera.'}
            </Text>
          </View>
          {canSuggest || suggestedCount > 0 || suggestion.status !== 'idle' ? (
            <View style={styles.suggest} testID="suggest-panel">
              {suggestedCount > 0 ? (
                <View style={styles.suggestButtons}>
                  <Button label={`Confirm ${suggestedCount} suggested points`} testID="suggest-confirm" onPress={confirmSuggestion} style={styles.grow} />
                  <Button tone="quiet" label="Discard" testID="suggest-discard" onPress={suggestion.clear} />
                </View>
              ) : canSuggest ? (
                <Button
                  tone="secondary"
                  label={suggestion.busy ? 'Finding the points…' : 'Suggest points from the photo'}
                  testID="suggest-run"
                  busy={suggestion.busy}
                  disabled={suggestion.busy}
                  onPress={() => void suggestion.run()}
                />
              ) : null}
              {suggestion.busy ? (
                <Text variant="small" testID="suggest-status" accessibilityLiveRegion="polite">
                  The first time, the pose model downloads (about 16 MB); finding the points can take up to a minute on an older phone. The photo stays on this
                  device.
                </Text>
              ) : suggestion.status === 'none' ? (
                <Notice tone="caution" testID="suggest-status">
                  No person was found clearly enough on this photo: place the points by tapping.
                </Notice>
              ) : suggestion.status === 'error' ? (
                <Notice tone="error" testID="suggest-status">
                  {`${suggestion.error ?? 'The suggestion failed.'} Place the points by tapping.`}
                </Notice>
              ) : suggestedCount === 0 && canSuggest ? (
                <Text variant="small">Runs on this device: the photo is not sent anywhere. You check every point before it counts.</Text>
              ) : null}
            </View>
          ) : null}
          {columnWidth > 0 ? (
            <View
              ref={surface}
              testID="landmark-surface"
              style={[styles.surface, { width: displayWidth, height: displayHeight }]}
              onStartShouldSetResponder={() => true}
              onMoveShouldSetResponder={() => true}
              onResponderTerminationRequest={() => false}
              onResponderGrant={onGrant}
              onResponderMove={onMove}
              onResponderRelease={onRelease}
            >
              <LazyPhotoOverlay
                href={apiAssetUrl(photo.url)}
                photoWidth={photo.width}
                photoHeight={photo.height}
                displayWidth={displayWidth}
                displayHeight={displayHeight}
                viewBox={vb}
                marks={marks}
                suggested={suggested}
                overlay={overlay}
                activeId={gesture.current?.mode === 'drag' ? gesture.current.dragId : active}
              />
            </View>
          ) : null}
          <View style={styles.controls}>
            <View style={styles.segment} accessibilityRole="radiogroup" accessibilityLabel="Zoom">
              {ZOOMS.map((z) => (
                <Pressable
                  key={z}
                  accessibilityRole="radio"
                  aria-checked={zoom === z}
                  accessibilityLabel={`Zoom ${z} times`}
                  testID={`zoom-${z}`}
                  onPress={() => setZoomAround(z)}
                  style={[styles.segmentItem, zoom === z && styles.segmentOn]}
                >
                  <Text style={[styles.segmentText, zoom === z && styles.segmentTextOn]}>{z}x</Text>
                </Pressable>
              ))}
            </View>
            <Button tone="secondary" label="Undo" testID="landmarks-undo" disabled={history.length === 0} onPress={undo} style={styles.grow} />
            <Button
              tone="quiet"
              label="Clear all"
              testID="landmarks-clear"
              disabled={placedCount === 0}
              onPress={() => {
                commit({});
                suggestion.clear();
                setSelected(null);
              }}
            />
          </View>
          <Text variant="small">Tap the photo to place the point named above. Drag a point to move it.{zoom > 1 ? ' Drag the photo to move around.' : ''}</Text>
          {shortcuts ? (
            <Text variant="small" testID="editor-shortcuts">
              {`Keys: ${EDITOR_SHORTCUTS.map((k) => `${k.keys} ${k.what}`).join(' · ')}`}
            </Text>
          ) : null}
        </View>
        <View style={[styles.listColumn, isWide && styles.listColumnWide]}>
          <View style={styles.angles} testID="live-angles" accessibilityLiveRegion="polite">
            <Text variant="label">Angles</Text>
            {overlay.angles.length === 0 ? (
              <Text variant="small">Angles appear here as soon as the points they need are placed.</Text>
            ) : (
              overlay.angles.map((a) => (
                <View key={a.id} style={styles.angle}>
                  <Text variant="small">{a.label}</Text>
                  <Text style={styles.angleValue}>{a.text}</Text>
                </View>
              ))
            )}
            {overlay.problems.map((p) => (
              <Notice key={p} tone="error">
                {`Check the points. ${p}`}
              </Notice>
            ))}
          </View>
          <View style={styles.list}>
            <Text variant="label">
              Points ({placedCount} of {needed.length} placed)
            </Text>
            {needed.map((id, i) => {
              const spec = getLandmark(id);
              const placed = !!marks[id];
              const waiting = !placed && !!suggested[id];
              const isActive = id === active;
              const state = placed
                ? marks[id]?.source === 'moved'
                  ? 'placed (suggested, moved)'
                  : marks[id]?.source === 'suggested'
                    ? 'placed (suggested)'
                    : 'placed'
                : waiting
                  ? 'suggested, not confirmed'
                  : 'not placed';
              return (
                <Pressable
                  key={id}
                  accessibilityRole="button"
                  aria-selected={isActive}
                  accessibilityLabel={`${spec.label}: ${state}. ${placed || waiting ? 'Tap to place again.' : ''}`}
                  testID={`landmark-item-${id}`}
                  onPress={() => setSelected(id === selected ? null : id)}
                  style={[styles.item, isActive && styles.itemActive]}
                >
                  <View style={[styles.badge, placed && styles.badgePlaced, waiting && styles.badgeSuggested]}>
                    <Text style={[styles.badgeText, placed && styles.badgeTextPlaced]}>{placed ? '✓' : waiting ? '?' : String(i + 1)}</Text>
                  </View>
                  <View style={styles.itemText}>
                    <Text variant="label">{spec.label}</Text>
                    {waiting ? <Text variant="small">Suggested: check it, then confirm</Text> : null}
                    {isActive ? <Text variant="small">{spec.hint}</Text> : null}
                  </View>
                </Pressable>
              );
            })}
          </View>
        </View>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  columns: { gap: space.lg },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  photoColumn: { gap: space.sm, alignItems: 'center', width: '100%' },
  photoColumnWide: { flex: 3 },
  prompt: {
    alignSelf: 'stretch',
    backgroundColor: colors.surface,
    borderRadius: radius.md,
    borderLeftWidth: 6,
    borderLeftColor: '#FF7A1A',
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    gap: 2,
  },
  // On a phone the photo runs below the fold: the point to tap next stays in view while the page scrolls
  // to it (web-only style keys).
  promptPinned: { position: 'sticky', top: 0, zIndex: 2 } as object,
  orientation: { color: colors.pineDark },
  // Web-only style keys: the browser must not scroll or select text while a finger places a point.
  surface: { backgroundColor: '#222', overflow: 'hidden', borderRadius: radius.sm, touchAction: 'none', userSelect: 'none' } as object,
  controls: { flexDirection: 'row', alignItems: 'center', gap: space.sm, alignSelf: 'stretch', flexWrap: 'wrap' },
  segment: { flexDirection: 'row', borderWidth: 2, borderColor: colors.pine, borderRadius: radius.md, overflow: 'hidden' },
  segmentItem: { minWidth: TOUCH_MIN, minHeight: TOUCH_MIN, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.surface },
  segmentOn: { backgroundColor: colors.pine },
  segmentText: { fontFamily: fonts.bold, fontSize: 17, color: colors.pine },
  segmentTextOn: { color: '#fff' },
  grow: { flexGrow: 1 },
  suggest: { alignSelf: 'stretch', gap: space.xs },
  suggestButtons: { flexDirection: 'row', gap: space.sm, alignItems: 'center' },
  listColumn: { gap: space.lg },
  listColumnWide: { flex: 2 },
  angles: { gap: space.sm, backgroundColor: colors.surface, borderRadius: radius.md, padding: space.md, borderWidth: 1, borderColor: colors.line },
  angle: { gap: 0 },
  angleValue: { fontFamily: fonts.bold, fontSize: 18 },
  list: { gap: space.xs },
  item: {
    minHeight: TOUCH_MIN,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.sm,
    paddingVertical: space.xs,
    borderRadius: radius.md,
    borderWidth: 2,
    borderColor: 'transparent',
  },
  itemActive: { borderColor: '#FF7A1A', backgroundColor: colors.surface },
  badge: { width: 30, height: 30, borderRadius: 15, borderWidth: 2, borderColor: colors.inkMuted, alignItems: 'center', justifyContent: 'center' },
  badgePlaced: { backgroundColor: colors.pine, borderColor: colors.pine },
  badgeSuggested: { borderStyle: 'dashed', borderColor: '#FF7A1A' },
  badgeText: { fontFamily: fonts.bold, fontSize: 14, color: colors.inkMuted },
  badgeTextPlaced: { color: '#fff' },
  itemText: { flex: 1 },
});
