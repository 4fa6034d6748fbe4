import { lazy, type ComponentType } from 'react';

type Loaded<P> = { default: ComponentType<P> };
type ExpoImport<M> = Promise<M> & { _result?: M | PromiseLike<M> };

/**
 * `React.lazy` that renders at once when the module is already there. Expo's `import()` returns a
 * promise that also carries the module as `_result` when no fetch is needed: on the web when the page's
 * HTML named the chunk (server/dev/route-chunks.mjs), and during the static render in Node. React.lazy
 * would still wait a turn for the promise; in the static render that leaves the boundary unfinished,
 * and the browser then throws the pre-rendered markup away and draws it again (React error 419). With
 * no `_result` (another bundler, a chunk not named by the page) this is plain `React.lazy`.
 */
export function lazyNow<P extends object>(load: () => Promise<Loaded<P>>) {
  return lazy(() => {
    const promise = load() as ExpoImport<Loaded<P>>;
    const now = promise._result;
    if (now && typeof (now as PromiseLike<unknown>).then !== 'function') {
      const ready = now as Loaded<P>;
      // A thenable that answers synchronously: React.lazy then marks the module resolved before it
      // would suspend.
      return { then: (resolve: (m: Loaded<P>) => void) => resolve(ready) } as unknown as Promise<Loaded<P>>;
    }
    return promise;
  });
}
