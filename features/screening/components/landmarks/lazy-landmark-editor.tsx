import { lazy, Suspense, type ComponentProps } from 'react';
import { Text } from '@/features/ui/components/text';

const Editor = lazy(() => import('./landmark-editor'));

/** The editor is a separate download, fetched when a tester first opens it. */
export function LazyLandmarkEditor(props: ComponentProps<typeof Editor>) {
  return (
    <Suspense fallback={<Text>Loading the landmark editor…</Text>}>
      <Editor {...props} />
    </Suspense>
  );
}
