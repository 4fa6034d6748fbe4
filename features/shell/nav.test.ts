import { describe, expect, it } from 'vitest';
import { navFor } from './nav';

describe('navFor', () => {
  it.each([
    ['admin', true, ['/', '/athletes', '/people', '/dev/mailbox']],
    ['admin', false, ['/', '/athletes', '/people']],
    ['head_coach', true, ['/', '/athletes', '/people']],
    ['tester', true, ['/', '/athletes']],
    ['physio', true, ['/', '/athletes']],
    ['parent', true, ['/']],
  ] as const)('%s (mailbox %s)', (role, mailbox, hrefs) => {
    expect(navFor(role, { mailbox }).map((i) => i.href)).toEqual(hrefs);
  });
});
