import { describe, expect, it } from 'vitest';
import { navFor } from './nav';

describe('navFor', () => {
  it.each([
    ['admin', true, ['/', '/athletes', '/screening', '/measuring', '/trends', '/training', '/people', '/audit', '/care-settings', '/dev/mailbox']],
    ['admin', false, ['/', '/athletes', '/screening', '/measuring', '/trends', '/training', '/people', '/audit', '/care-settings']],
    ['head_coach', true, ['/', '/athletes', '/screening', '/measuring', '/trends', '/training', '/reviews', '/people']],
    ['tester', true, ['/', '/athletes', '/screening', '/measuring', '/trends', '/training']],
    ['physio', true, ['/', '/athletes', '/screening', '/trends', '/training', '/reviews']],
    ['parent', true, ['/']],
  ] as const)('%s (mailbox %s)', (role, mailbox, hrefs) => {
    expect(navFor(role, { mailbox }).map((i) => i.href)).toEqual(hrefs);
  });
});
