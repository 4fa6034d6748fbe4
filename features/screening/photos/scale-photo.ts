import type { PickedPhoto } from './pick-photo';
import type { ScaledPhoto } from './photo-size';

/**
 * Native: the picker's quality setting already compresses, and the server re-encodes and strips
 * metadata. Scaling on the phone would need expo-image-manipulator, which the app does not ship;
 * the web sibling (scale-photo.web.ts) scales with a canvas.
 */
export async function scalePhoto(photo: PickedPhoto): Promise<ScaledPhoto> {
  return {
    file: { uri: photo.uri, name: photo.fileName ?? 'photo.jpg', type: photo.mimeType ?? 'image/jpeg' },
    previewUri: photo.uri,
    width: photo.width,
    height: photo.height,
  };
}
