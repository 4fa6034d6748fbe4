import { lazy, Suspense, type ComponentProps } from 'react';
import { View } from 'react-native';
import { colors } from '@/features/ui/theme';
import type { PhotoOverlay } from './photo-overlay';

const Overlay = lazy(() => import('./photo-overlay').then((m) => ({ default: m.PhotoOverlay })));

/**
 * The photo with its drawing is a separate download (it brings the SVG library): two screens use it, and
 * a module two screens share would otherwise be loaded by every page, the sign-in page included. Until it
 * arrives, a blank frame of the same size holds the place, so nothing moves.
 */
export function LazyPhotoOverlay(props: ComponentProps<typeof PhotoOverlay>) {
  return (
    <Suspense fallback={<View style={{ width: props.displayWidth, height: props.displayHeight, backgroundColor: colors.line }} />}>
      <Overlay {...props} />
    </Suspense>
  );
}
