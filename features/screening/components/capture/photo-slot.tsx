import { useEffect, useRef, useState } from 'react';
import { Image, Platform, StyleSheet, View } from 'react-native';
import { apiAssetUrl } from '@/features/api/client';
import type { PhotoView } from '@/features/screening/contract';
import type { TaskId, ViewSpec } from '@/features/screening/engine';
import { useUploadItem } from '@/features/screening/hooks/use-upload';
import { pickPhoto } from '@/features/screening/photos/pick-photo';
import { scalePhoto } from '@/features/screening/photos/scale-photo';
import { slotOf } from '@/features/screening/photos/upload-queue';
import { uploadQueue } from '@/features/screening/photos/upload-registry';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, radius, space } from '@/features/ui/theme';
import { ProgressBar } from '../progress-bar';

type Props = {
  assessmentId: string;
  taskId: TaskId;
  spec: ViewSpec;
  photo: PhotoView | undefined;
  placed: number;
  onNewPhoto(): void;
  onPlaceLandmarks(): void;
  /** The previous slot of the task was just filled: this one opens its camera by itself (burst). */
  armed?: boolean;
  /** A photo was picked for this slot (it may still be uploading). */
  onPicked?(): void;
};

/**
 * Whether the camera may be opened without a new tap. Native pickers may; a browser opens a file
 * chooser only while the tap that started the previous photo still counts as the user's gesture.
 */
function mayOpenByItself(): boolean {
  if (Platform.OS !== 'web') return true;
  const activation = (globalThis.navigator as (Navigator & { userActivation?: { isActive: boolean } }) | undefined)?.userActivation;
  return activation?.isActive === true;
}

const VIEW_WORD = { front: 'Front', side: 'Side' } as const;

/** One photo of a task: take or choose it, see it upload, retry, then place its landmarks. */
export function PhotoSlot({ assessmentId, taskId, spec, photo, placed, onNewPhoto, onPlaceLandmarks, armed = false, onPicked }: Props) {
  const slot = slotOf(taskId, spec.view);
  const { isTabletUp } = useBreakpoints();
  const item = useUploadItem(assessmentId, slot);
  const [preparing, setPreparing] = useState(false);
  const [pickError, setPickError] = useState<string | null>(null);
  const root = useRef<View>(null);
  const title = `${VIEW_WORD[spec.view]} photo${spec.required ? '' : ' (optional)'}`;
  const testID = `photo-${spec.view}`;

  const choose = async (source: 'camera' | 'library') => {
    setPickError(null);
    try {
      const picked = await pickPhoto(source);
      if (!picked) return;
      setPreparing(true);
      onPicked?.();
      const scaled = await scalePhoto(picked);
      // Kept on the phone (within its photo budget) and queued: it uploads now, or when the connection is back.
      await uploadQueue.start({ assessmentId, taskId, view: spec.view, ...scaled });
      setPreparing(false);
      onNewPhoto();
    } catch (e) {
      setPreparing(false);
      setPickError(e instanceof Error ? e.message : String(e));
    }
  };

  // Burst: the next empty slot opens the camera by itself when it may, and otherwise comes into view.
  const empty = !photo && !item;
  useEffect(() => {
    if (!armed || !empty) return;
    if (mayOpenByItself()) {
      void choose('camera');
      return;
    }
    const node = root.current as unknown as { scrollIntoView?: (o: object) => void } | null;
    node?.scrollIntoView?.({ block: 'center', behavior: 'smooth' });
    // Only when armed changes: a cancelled camera must not reopen.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [armed]);

  // The server refuses a photo without consent (a consent withdrawn since the page loaded): its message,
  // and no photo control.
  if (item?.error?.code === 'no_photo_consent') {
    return (
      <Notice tone="error" title={`${title}: no photo consent`} testID={`${testID}-no-consent`}>
        {item.error.message}
      </Notice>
    );
  }

  const uploading = item?.state === 'uploading';
  const waiting = item?.state === 'waiting';
  const failed = item?.state === 'failed';
  // A lost connection or a server hiccup is worth retrying; a refused file (too large, not a photo) is not.
  const retryable = !!item?.error && (item.error.status === 0 || item.error.status === 408 || item.error.status === 429 || item.error.status >= 500);
  const shown = item?.previewUri
    ? { uri: item.previewUri, w: item.width, h: item.height }
    : photo
      ? { uri: apiAssetUrl(photo.thumbUrl), w: photo.width, h: photo.height }
      : null;

  return (
    <View ref={root} style={[styles.slot, armed && empty && styles.slotArmed]} testID={testID}>
      <Text variant="label">{title}</Text>
      <Text variant="small">{spec.capture}</Text>
      {shown ? (
        <Image
          source={{ uri: shown.uri }}
          style={[
            styles.preview,
            { aspectRatio: shown.w / Math.max(shown.h, 1) },
            !isTabletUp && styles.previewPhone,
            (uploading || waiting || failed) && styles.previewPending,
          ]}
          resizeMode="contain"
          accessibilityLabel={`${title} of the task`}
        />
      ) : null}
      {uploading ? (
        <View style={styles.progress} testID={`${testID}-uploading`}>
          <Text variant="small">Uploading… {Math.round((item.progress ?? 0) * 100)}%</Text>
          <ProgressBar fraction={item.progress} label="Upload progress" />
        </View>
      ) : null}
      {waiting ? (
        <View style={styles.progress} testID={`${testID}-waiting`}>
          <Text variant="small">
            {item.error
              ? 'Kept on this phone: the upload did not get through and is tried again shortly.'
              : 'Kept on this phone: uploads when there is a connection.'}
          </Text>
          <Button tone="quiet" label="Discard this photo" testID={`${testID}-discard`} onPress={() => uploadQueue.discard(assessmentId, slot)} />
        </View>
      ) : null}
      {failed && item.error ? (
        <View style={styles.actions}>
          <Notice tone="error" title={retryable ? 'The photo is not uploaded yet' : 'This photo was refused'} testID={`${testID}-upload-error`}>
            {retryable ? `${item.error.message} The photo is kept on this phone: try again.` : `${item.error.message} Take or choose another photo.`}
          </Notice>
          {retryable ? <Button label="Retry upload" testID={`${testID}-retry`} onPress={() => uploadQueue.retry(assessmentId, slot)} /> : null}
          <Button
            tone={retryable ? 'quiet' : 'secondary'}
            label="Discard this photo"
            testID={`${testID}-discard`}
            onPress={() => uploadQueue.discard(assessmentId, slot)}
          />
        </View>
      ) : null}
      {preparing ? <Text variant="small">Preparing the photo…</Text> : null}
      {pickError ? <Notice tone="error">{pickError}</Notice> : null}
      {photo && (!item || (waiting && item.previewUri)) ? (
        <View style={styles.actions}>
          <Text variant="small" testID={`${testID}-placed`}>
            {placed === 0
              ? 'No landmarks placed yet: they can wait for the "To measure" list at a desk.'
              : `${placed} of ${spec.landmarks.length} landmarks placed.`}
          </Text>
          <Button
            tone={placed === 0 ? 'quiet' : 'secondary'}
            label={placed === 0 ? 'Place landmarks now' : 'Adjust landmarks'}
            testID={`${testID}-landmarks`}
            onPress={onPlaceLandmarks}
          />
        </View>
      ) : null}
      {!uploading && !failed ? (
        <View style={styles.pickRow}>
          <Button
            tone={photo || item ? 'secondary' : 'primary'}
            label={photo || item ? 'Retake' : 'Take photo'}
            testID={`${testID}-camera`}
            disabled={preparing}
            onPress={() => void choose('camera')}
            style={styles.pick}
          />
          <Button
            tone="secondary"
            label="Choose photo"
            testID={`${testID}-library`}
            disabled={preparing}
            onPress={() => void choose('library')}
            style={styles.pick}
          />
        </View>
      ) : null}
      {photo && placed > 0 && !uploading && !failed ? <Text variant="small">A new photo clears the landmarks placed on this one.</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  slot: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface },
  slotArmed: { borderWidth: 3, borderColor: colors.pine },
  preview: { width: '100%', maxHeight: 320, borderRadius: radius.sm, backgroundColor: '#222' },
  // On a phone a taken photo is a check that it is there and sharp, not where points are placed: half the
  // height keeps the ticks below it about a screen nearer (our choice).
  previewPhone: { maxHeight: 160 },
  previewPending: { opacity: 0.6 },
  progress: { gap: space.xs },
  actions: { gap: space.sm },
  pickRow: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
  pick: { flexGrow: 1, flexBasis: 140 },
});
