import { describe, expect, it } from 'vitest';
import { navFor } from './nav';

describe('navFor', () => {
  it.each([
    ['admin', true, ['/', '/athletes', '/screening', '/measuring', '/trends', '/people', '/audit', '/care-settings', '/dev/mailbox']],
    ['admin', false, ['/', '/athletes', '/screening', '/measuring', '/trends', '/people', '/audit', '/care-settings']],
    ['head_coach', true, ['/', '/athletes', '/screening', '/measuring', '/trends', '/reviews', '/people']],
    ['tester', true, ['/', '/athletes', '/screening', '/measuring', '/trends']],
    ['physio', true, ['/', '/athletes', '/screening', '/trends', '/reviews']],
    ['parent', true, ['/']],
  ] as const)('%s (mailbox %s)', (role, mailbox, hrefs) => {
    expect(navFor(role, { mailbox }).map((i) => i.href)).toEqual(hrefs);
  });
});
