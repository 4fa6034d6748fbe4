import { lazy, Suspense } from 'react';

const Clearance = lazy(() => import('./care-panels').then((m) => ({ default: m.ClearancePanel })));
const Notes = lazy(() => import('./care-panels').then((m) => ({ default: m.NotesPanel })));

/*
 * The clearance and notes panels (their forms, schemas and mutations) are separate downloads: the athlete
 * page and the result screen both show them, and a module two screens share would otherwise be loaded by
 * every page. Both screens take them from here, in one chunk (care-panels.tsx). They sit below the
 * screen's own content and fetch their data when mounted, so the wait adds little.
 *
 * One boundary for both: with one each, the notes could arrive first and the clearance then push them
 * down under a finger already on the note form.
 */
export function LazyCarePanels({ athleteId, assessmentId }: { athleteId: string; assessmentId?: string }) {
  return (
    <Suspense fallback={null}>
      <Clearance athleteId={athleteId} />
      <Notes athleteId={athleteId} assessmentId={assessmentId} />
    </Suspense>
  );
}
