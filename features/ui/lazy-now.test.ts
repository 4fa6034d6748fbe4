import { createElement, Suspense, type ComponentType, type ReactElement } from 'react';
import { beforeAll, describe, expect, it } from 'vitest';
import { lazyNow } from './lazy-now';

// React's server renderer, as the static render uses it (no type package is installed for it).
const SERVER = 'react-dom/server';
let renderToString: (element: ReactElement) => string;
beforeAll(async () => {
  ({ renderToString } = (await import(SERVER)) as { renderToString: typeof renderToString });
});

const Shell = () => createElement('p', null, 'the shell');
const inBoundary = (C: ComponentType) => renderToString(createElement(Suspense, { fallback: createElement('p', null, 'waiting') }, createElement(C)));
const carrying = <M>(m: M, result: unknown) => Object.assign(Promise.resolve(m), { _result: result });

describe('lazyNow', () => {
  it('renders in the same pass when the import carries the module (a chunk the page named, the static render)', () => {
    const html = inBoundary(lazyNow(() => carrying({ default: Shell }, { default: Shell })));
    expect(html).toContain('the shell');
    expect(html).not.toContain('waiting');
  });

  it('waits like React.lazy when the module must still be fetched, or the import carries nothing', () => {
    for (const C of [lazyNow(() => carrying({ default: Shell }, Promise.resolve({ default: Shell }))), lazyNow(() => Promise.resolve({ default: Shell }))]) {
      const html = inBoundary(C);
      expect(html).toContain('waiting');
      expect(html).not.toContain('the shell');
    }
  });
});
