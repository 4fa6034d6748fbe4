import type { PickedPhoto } from './pick-photo';
import { MAX_LONG_SIDE, type ScaledPhoto } from './photo-size';

function loadImage(src: string): Promise<HTMLImageElement> {
  return new Promise((resolve, reject) => {
    const img = new Image();
    img.onload = () => resolve(img);
    img.onerror = () => reject(new Error('This file could not be read as a photo. Choose a JPEG or PNG photo.'));
    img.src = src;
  });
}

/** Scales the photo down on a canvas (long side at most 1600 px) and re-encodes it as JPEG. */
export async function scalePhoto(photo: PickedPhoto): Promise<ScaledPhoto> {
  const img = await loadImage(photo.uri);
  const w0 = img.naturalWidth || photo.width;
  const h0 = img.naturalHeight || photo.height;
  if (!w0 || !h0) throw new Error('This file could not be read as a photo. Choose a JPEG or PNG photo.');
  const scale = Math.min(1, MAX_LONG_SIDE / Math.max(w0, h0));
  const width = Math.round(w0 * scale);
  const height = Math.round(h0 * scale);
  const canvas = document.createElement('canvas');
  canvas.width = width;
  canvas.height = height;
  const ctx = canvas.getContext('2d');
  if (!ctx) throw new Error('This browser cannot prepare the photo. Try another browser.');
  ctx.fillStyle = '#fff';
  ctx.fillRect(0, 0, width, height);
  ctx.imageSmoothingQuality = 'high';
  // Browsers apply the camera's orientation tag when drawing, so the scaled photo is upright.
  ctx.drawImage(img, 0, 0, width, height);
  const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/jpeg', 0.85));
  if (!blob) throw new Error('This browser cannot prepare the photo. Try another browser.');
  return { file: { blob, name: 'photo.jpg' }, previewUri: URL.createObjectURL(blob), width, height };
}
