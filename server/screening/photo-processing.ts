import pLimit from 'p-limit';
import sharp from 'sharp';
import { AppError } from '@/server/http/errors';

/** Multer's limit; the client scales photos down before upload, so this only stops the absurd. */
export const MAX_UPLOAD_BYTES = 12 * 1024 * 1024;
export const FULL_LONG_SIDE_PX = 1600;
export const THUMB_LONG_SIDE_PX = 320;
/**
 * libjpeg-turbo's encoder with its default tables and optimised Huffman coding (sharp's default), not
 * mozjpeg: measured on a 1200x1600 photo (2 cores), mozjpeg took 250-330 ms to encode the full image
 * and libjpeg-turbo 32-45 ms, for files about a third larger (260 KB against 200 KB). Fifty uploads at
 * once on a small server then finish in seconds instead of queueing past a phone's timeout; storage is
 * cheaper than that wait. Our choice.
 */
const JPEG_QUALITY = 82;
const THUMB_QUALITY = 75;
/**
 * sharp runs each operation on one of libuv's threads (4 unless UV_THREADPOOL_SIZE says otherwise),
 * shared with file writes, Argon2id (two at a time, server/auth/password.ts) and the database driver's
 * SCRAM handshake. At most two images are worked on at once per process, one per core of a small
 * server, so photo uploads never hold every thread; the other uploads wait here, in JavaScript. Our choice.
 */
export const IMAGE_CONCURRENCY = 2;
const imageWork = pLimit(IMAGE_CONCURRENCY);
let working = 0;
let maxWorking = 0;
/** Images being worked on now, and the most at once since the process started (a test reads the bound). */
export const imageWorkStats = () => ({ working, maxWorking, waiting: imageWork.pendingCount });
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
export function processPhoto(input: Buffer): Promise<ProcessedPhoto> {
  return imageWork(async () => {
    maxWorking = Math.max(maxWorking, ++working);
    try {
      return await processNow(input);
    } finally {
      working--;
    }
  });
}

async function processNow(input: Buffer): Promise<ProcessedPhoto> {
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
      .jpeg({ quality: JPEG_QUALITY })
      .toBuffer({ resolveWithObject: true });
    // From the image just made: already upright and flattened, and at a fifth of its size libjpeg
    // decodes it at a quarter scale (shrink-on-load), so this costs about as much as resizing the
    // decoded pixels would (measured 10-20 ms) without holding them in memory meanwhile.
    const thumb = await sharp(full)
      .resize({ width: THUMB_LONG_SIDE_PX, height: THUMB_LONG_SIDE_PX, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: THUMB_QUALITY })
      .toBuffer();
    return { full, thumb, width: info.width, height: info.height };
  } catch {
    throw new AppError(400, 'unreadable_photo', 'The photo could not be read: the file may be damaged or cut short. Please take or choose it again.');
  }
}
