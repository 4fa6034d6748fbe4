import { describe, expect, it } from 'vitest';
import { navFor } from './nav';

describe('navFor', () => {
  it.each([
    ['admin', true, ['/', '/athletes', '/screening', '/people', '/audit', '/care-settings', '/dev/mailbox']],
    ['admin', false, ['/', '/athletes', '/screening', '/people', '/audit', '/care-settings']],
    ['head_coach', true, ['/', '/athletes', '/screening', '/reviews', '/people']],
    ['tester', true, ['/', '/athletes', '/screening']],
    ['physio', true, ['/', '/athletes', '/screening', '/reviews']],
    ['parent', true, ['/']],
  ] as const)('%s (mailbox %s)', (role, mailbox, hrefs) => {
    expect(navFor(role, { mailbox }).map((i) => i.href)).toEqual(hrefs);
  });
});
