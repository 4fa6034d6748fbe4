// Runs the pose model in the browser, from files Squadline serves itself. Nothing here is bundled with
// the app: the runtime is a classic script fetched the first time someone asks for a suggestion, and the
// photo never leaves the page (the model reads it from an <img> of our own origin).
import type { NormalizedLandmark, Options, PoseConfig, Results } from '@mediapipe/pose';
import type { ModelPoint } from './map-pose';
import { POSE_MODEL_BASE } from './model-files';

export const poseAvailable = true;

type PoseInstance = {
  setOptions(options: Options): void;
  onResults(listener: (results: Results) => void): void;
  initialize(): Promise<void>;
  reset(): void;
  send(inputs: { image: HTMLImageElement }): Promise<void>;
};
type PoseConstructor = new (config?: PoseConfig) => PoseInstance;

let runtime: Promise<PoseConstructor> | null = null;

/** Adds the runtime's script once; later calls share it. */
function loadRuntime(): Promise<PoseConstructor> {
  runtime ??= new Promise<PoseConstructor>((resolve, reject) => {
    const existing = (globalThis as { Pose?: PoseConstructor }).Pose;
    if (existing) return resolve(existing);
    const script = document.createElement('script');
    script.src = `${POSE_MODEL_BASE}/pose.js`;
    script.async = true;
    script.onload = () => {
      const Pose = (globalThis as { Pose?: PoseConstructor }).Pose;
      if (Pose) resolve(Pose);
      else reject(new Error('The pose model did not load.'));
    };
    script.onerror = () => reject(new Error('The pose model could not be downloaded.'));
    document.head.appendChild(script);
  }).catch((e: unknown) => {
    runtime = null;
    throw e;
  });
  return runtime;
}

let model: Promise<{ pose: PoseInstance; next: { resolve(r: Results): void } | null }> | null = null;

/** One model instance for the page: loading it takes seconds, each photo after that is quicker. */
function loadModel() {
  model ??= loadRuntime()
    .then(async (Pose) => {
      const pose = new Pose({ locateFile: (file) => `${POSE_MODEL_BASE}/${file}` });
      // The middle of the package's three models (6.4 MB): the light one misplaces knees more often, the
      // heavy one is 28 MB for a small gain (our choice). Still photos: no smoothing between frames.
      pose.setOptions({ modelComplexity: 1, smoothLandmarks: false, enableSegmentation: false });
      const holder: { pose: PoseInstance; next: { resolve(r: Results): void } | null } = { pose, next: null };
      pose.onResults((r) => holder.next?.resolve(r));
      await pose.initialize();
      return holder;
    })
    .catch((e: unknown) => {
      model = null;
      throw e;
    });
  return model;
}

function loadImage(url: string): Promise<HTMLImageElement> {
  return new Promise((resolve, reject) => {
    const img = new Image();
    img.onload = () => resolve(img);
    img.onerror = () => reject(new Error('The photo could not be read.'));
    img.src = url;
  });
}

let queue: Promise<unknown> = Promise.resolve();

/** The body points the model finds on a photo (empty when it finds no person). One photo at a time. */
export function detectPose(imageUrl: string): Promise<ModelPoint[]> {
  const run = queue.then(async () => {
    const [holder, image] = await Promise.all([loadModel(), loadImage(imageUrl)]);
    // Each photo is a new scene: forget the previous photo's person so the model looks for one afresh.
    holder.pose.reset();
    const results = await new Promise<Results>((resolve, reject) => {
      holder.next = { resolve };
      holder.pose.send({ image }).catch(reject);
    });
    holder.next = null;
    return (results.poseLandmarks ?? []).map((p: NormalizedLandmark) => ({ x: p.x, y: p.y, z: p.z, visibility: p.visibility }));
  });
  queue = run.catch(() => undefined);
  return run;
}
