import { describe, expect, it } from 'vitest';
import { returnPath } from './return-to';

describe('returnPath (where sign-in goes next)', () => {
  it('follows a path of the app, with its query', () => {
    expect(returnPath('/family/3f1c')).toBe('/family/3f1c');
    expect(returnPath('/reviews?athlete=1')).toBe('/reviews?athlete=1');
    expect(returnPath('/')).toBe('/');
  });

  it('goes home for anything that could leave the app or loop', () => {
    for (const bad of [
      'https://evil.test/',
      '//evil.test/x',
      '/\\evil.test',
      'javascript:alert(1)',
      'family/1',
      '/sign-in',
      '/sign-in?next=/x',
      '/a\nb',
      '',
      undefined,
      42,
      ['/x'],
      `/${'a'.repeat(600)}`,
    ]) {
      expect(returnPath(bad)).toBe('/');
    }
  });
});
