import { useCallback, useEffect, useRef, useState } from 'react';
import { suggestLandmarks } from '@/features/pose-suggestion/map-pose';
import { detectPose } from '@/features/pose-suggestion/run-pose';
import type { LandmarkSet, PhotoView } from '@/features/screening/contract';
import type { LandmarkId, Point, Side, View } from '@/features/screening/engine';

type Status = 'idle' | 'busy' | 'done' | 'none' | 'error';

/**
 * Points suggested by the pose model for one photo, kept apart from the placed points until the tester
 * confirms them (`take`). Each waiting point is "suggested", or "moved" once dragged.
 */
export function useSuggestion(opts: { photo: PhotoView; view: View; needed: readonly LandmarkId[]; racketHand?: Side; placed: LandmarkSet }) {
  const [points, setPointsState] = useState<LandmarkSet>({});
  const [status, setStatus] = useState<Status>('idle');
  const [error, setError] = useState<string | null>(null);
  const current = useRef<LandmarkSet>({});
  const latest = useRef(opts);
  latest.current = opts;
  const mounted = useRef(true);
  useEffect(
    () => () => {
      mounted.current = false;
    },
    [],
  );

  const setPoints = useCallback((next: LandmarkSet) => {
    current.current = next;
    setPointsState(next);
  }, []);

  const run = useCallback(async () => {
    setStatus('busy');
    setError(null);
    try {
      const { photo, view, needed, racketHand } = latest.current;
      const found = suggestLandmarks(await detectPose(photo.url), { view, needed, racketHand, width: photo.width, height: photo.height });
      if (!mounted.current) return;
      // Points placed while the model ran are the tester's: no suggestion over them.
      const placed = latest.current.placed;
      const next: LandmarkSet = {};
      for (const [id, p] of Object.entries(found) as [LandmarkId, Point][]) {
        if (!placed[id]) next[id] = { ...p, source: 'suggested' };
      }
      setPoints(next);
      setStatus(Object.keys(next).length > 0 ? 'done' : 'none');
    } catch (e) {
      if (!mounted.current) return;
      setError(e instanceof Error ? e.message : String(e));
      setStatus('error');
    }
  }, [setPoints]);

  const move = useCallback(
    (id: LandmarkId, to: Point) => {
      if (current.current[id]) setPoints({ ...current.current, [id]: { x: to.x, y: to.y, source: 'moved' } });
    },
    [setPoints],
  );

  const drop = useCallback(
    (id: LandmarkId) => {
      if (!current.current[id]) return;
      const { [id]: _dropped, ...rest } = current.current;
      setPoints(rest);
    },
    [setPoints],
  );

  const clear = useCallback(() => {
    setPoints({});
    setStatus('idle');
  }, [setPoints]);

  /** Hands the waiting points over (to be placed) and forgets them. */
  const take = useCallback((): LandmarkSet => {
    const taken = current.current;
    setPoints({});
    setStatus('idle');
    return taken;
  }, [setPoints]);

  return { points, status, error, busy: status === 'busy', run, move, drop, clear, take };
}
