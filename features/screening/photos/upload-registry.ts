import { deviceSession, forgetPhoto, keepPhoto, outbox, photoUrl } from '@/features/offline/device';
import { UploadQueue } from './upload-queue';

/** The page's one view of the photos waiting on the device; uploads continue between steps and reloads. */
export const uploadQueue = new UploadQueue({ outbox, keepPhoto, forgetPhoto, photoUrl, session: deviceSession });
