import { lazy, Suspense, type ComponentProps } from 'react';
import { Text } from '@/features/ui/components/text';

const Form = lazy(() => import('./athlete-form').then((m) => ({ default: m.AthleteForm })));

/**
 * The athlete form (with its choice groups) is a separate download: the new-athlete page and the athlete
 * page's editing both use it, and a module two screens share would otherwise be loaded by every page.
 */
export function LazyAthleteForm(props: ComponentProps<typeof Form>) {
  return (
    <Suspense fallback={<Text>Loading the form…</Text>}>
      <Form {...props} />
    </Suspense>
  );
}
