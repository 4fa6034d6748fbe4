import { describe, expect, it } from 'vitest';
import { navFor } from './nav';

describe('navFor', () => {
  it.each([
    ['admin', true, ['/', '/athletes', '/screening', '/measuring', '/people', '/dev/mailbox']],
    ['admin', false, ['/', '/athletes', '/screening', '/measuring', '/people']],
    ['head_coach', true, ['/', '/athletes', '/screening', '/measuring', '/people']],
    ['tester', true, ['/', '/athletes', '/screening', '/measuring']],
    ['physio', true, ['/', '/athletes', '/screening']],
    ['parent', true, ['/']],
  ] as const)('%s (mailbox %s)', (role, mailbox, hrefs) => {
    expect(navFor(role, { mailbox }).map((i) => i.href)).toEqual(hrefs);
  });
});
