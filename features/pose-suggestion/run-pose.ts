import type { ModelPoint } from './map-pose';

/** The pose model runs in a web browser only (WebAssembly and WebGL); a native build offers no suggestion. */
export const poseAvailable = false;

export async function detectPose(_imageUrl: string): Promise<ModelPoint[]> {
  throw new Error('Suggested points need the web app.');
}
