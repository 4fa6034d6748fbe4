import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { apiAssetUrl } from '@/features/api/client';
import type { AssessmentDetail, PhotoView } from '@/features/screening/contract';
import { BATTERY, getTask } from '@/features/screening/engine/battery';
import { overlayFor } from '@/features/screening/overlay/overlay';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Text } from '@/features/ui/components/text';
import { colors, radius, space } from '@/features/ui/theme';
import { LazyPhotoOverlay } from '../landmarks/lazy-photo-overlay';

function current(photos: PhotoView[]): PhotoView[] {
  const map = new Map<string, PhotoView>();
  for (const p of photos) {
    const key = `${p.taskId}:${p.view}`;
    const known = map.get(key);
    if (!known || known.createdAt < p.createdAt) map.set(key, p);
  }
  const order = BATTERY.map((t) => t.id);
  return [...map.values()].sort((a, b) => order.indexOf(a.taskId) - order.indexOf(b.taskId) || a.view.localeCompare(b.view));
}

/** The photos with their landmarks, lines and angles, as placed. */
export function ResultPhotos({ detail }: { detail: AssessmentDetail }) {
  const photos = current(detail.photos);
  const { isTabletUp } = useBreakpoints();
  if (photos.length === 0) return null;
  return (
    <View style={styles.wrap} testID="result-photos">
      <Text variant="heading" accessibilityRole="header" aria-level={2}>
        Photos
      </Text>
      <View style={[styles.grid, isTabletUp && styles.gridWide]}>
        {photos.map((p) => (
          <ResultPhoto key={p.id} photo={p} detail={detail} wide={isTabletUp} />
        ))}
      </View>
    </View>
  );
}

function ResultPhoto({ photo, detail, wide }: { photo: PhotoView; detail: AssessmentDetail; wide: boolean }) {
  const [width, setWidth] = useState(0);
  const task = getTask(photo.taskId);
  const marks = detail.draft.tasks[photo.taskId]?.landmarks?.[photo.view] ?? {};
  const overlay = overlayFor(task, photo.view, marks, detail.athlete.racketHand);
  return (
    <View style={[styles.card, wide && styles.cardWide]} testID={`result-photo-${photo.taskId}-${photo.view}`}>
      <Text variant="label">
        {task.title}, {photo.view} view
      </Text>
      {/* The photo's room, from its proportions, from the first frame: measuring it and drawing the photo
          afterwards moves nothing below (a result's care notes and round buttons). */}
      <View style={[styles.photoRoom, { aspectRatio: photo.width / photo.height }]} onLayout={(e) => setWidth(Math.floor(e.nativeEvent.layout.width))}>
        {width > 0 ? (
          <LazyPhotoOverlay
            href={apiAssetUrl(photo.url)}
            photoWidth={photo.width}
            photoHeight={photo.height}
            displayWidth={width}
            displayHeight={(width * photo.height) / photo.width}
            marks={marks}
            overlay={overlay}
          />
        ) : null}
      </View>
      {overlay.angles.map((a) => (
        <Text key={a.id} variant="small">
          {a.label}: {a.text}
        </Text>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  grid: { gap: space.md },
  gridWide: { flexDirection: 'row', flexWrap: 'wrap' },
  card: {
    gap: space.xs,
    padding: space.md,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.line,
    alignItems: 'flex-start',
  },
  cardWide: { flexBasis: 320, flexGrow: 1 },
  photoRoom: { width: '100%', maxWidth: 420 },
});
