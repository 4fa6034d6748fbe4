import sharp from 'sharp';
import { AppError } from '@/server/http/errors';

/** Multer's limit; the client scales photos down before upload, so this only stops the absurd. */
export const MAX_UPLOAD_BYTES = 12 * 1024 * 1024;
export const FULL_LONG_SIDE_PX = 1600;
export const THUMB_LONG_SIDE_PX = 320;
const JPEG_QUALITY = 82;
const THUMB_QUALITY = 75;
/** Refuse decompression bombs: a 12 MB file can claim billions of pixels. 100 MP covers any phone. */
const MAX_INPUT_PIXELS = 100_000_000;

const ACCEPTED = new Set(['jpeg', 'png', 'webp', 'heif']);

export type ProcessedPhoto = { full: Buffer; thumb: Buffer; width: number; height: number };

const unsupported = (message: string) => new AppError(415, 'unsupported_type', message);

/**
 * Reads the type from the bytes (never the file name or the declared type), applies the EXIF
 * orientation, scales to fit 1600 px, and re-encodes as JPEG. sharp writes no EXIF, XMP, IPTC or ICC
 * data unless asked (withMetadata/keepMetadata), so location and camera details are gone; a test
 * reads the stored bytes back to prove it.
 */
export async function processPhoto(input: Buffer): Promise<ProcessedPhoto> {
  let format: string | undefined;
  let compression: string | undefined;
  let width: number | undefined;
  let height: number | undefined;
  try {
    // metadata() reads the header only: a decompression bomb is seen here before any pixel is decoded.
    ({ format, compression, width, height } = await sharp(input, { limitInputPixels: false }).metadata());
  } catch {
    throw unsupported('This file is not a photo we can read. Send a JPEG, PNG, WebP or AVIF image.');
  }
  if (width !== undefined && height !== undefined && width * height > MAX_INPUT_PIXELS) {
    throw new AppError(
      413,
      'too_many_pixels',
      `This image is ${width} x ${height} pixels, more than any phone camera takes (at most ${MAX_INPUT_PIXELS / 1_000_000} megapixels). Send the photo as the camera took it.`,
    );
  }
  if (!format || !ACCEPTED.has(format)) {
    throw unsupported(`${format ? `${format.toUpperCase()} files are` : 'This file is'} not accepted: send a JPEG, PNG, WebP or AVIF photo.`);
  }
  // The bundled libheif decodes AVIF only; iPhone HEIC (HEVC) photos must be converted on the phone.
  if (format === 'heif' && compression !== 'av1') {
    throw unsupported('HEIC photos cannot be read here. Set the camera to "Most Compatible" (JPEG) or choose the photo again so the app converts it.');
  }

  try {
    const { data: full, info } = await sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' })
      .rotate()
      .resize({ width: FULL_LONG_SIDE_PX, height: FULL_LONG_SIDE_PX, fit: 'inside', withoutEnlargement: true })
      .flatten({ background: '#ffffff' })
      .jpeg({ quality: JPEG_QUALITY, mozjpeg: true })
      .toBuffer({ resolveWithObject: true });
    const thumb = await sharp(full)
      .resize({ width: THUMB_LONG_SIDE_PX, height: THUMB_LONG_SIDE_PX, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: THUMB_QUALITY, mozjpeg: true })
      .toBuffer();
    return { full, thumb, width: info.width, height: info.height };
  } catch {
    throw new AppError(400, 'unreadable_photo', 'The photo could not be read: the file may be damaged or cut short. Please take or choose it again.');
  }
}
