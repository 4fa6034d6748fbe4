import { uploadPhoto } from '@/features/screening/api/upload-photo';
import { UploadQueue } from './upload-queue';

/** The page's one upload queue: uploads continue while the tester moves between steps. */
export const uploadQueue = new UploadQueue(uploadPhoto);
