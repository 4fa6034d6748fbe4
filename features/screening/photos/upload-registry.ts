import { deviceSession, forgetPhoto, keepPhoto, lateBound, outbox, photoUrl } from '@/features/offline/device-handle';
import { UploadQueue } from './upload-queue';

let queue: UploadQueue | null = null;

/**
 * The page's one view of the photos waiting on the device; uploads continue between steps and reloads.
 * Made on first use (the outbox it watches exists once the device store has loaded, see DeviceGate).
 */
export const uploadQueue: UploadQueue = lateBound(() => (queue ??= new UploadQueue({ outbox, keepPhoto, forgetPhoto, photoUrl, session: deviceSession })));
