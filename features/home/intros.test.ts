import { describe, expect, it } from 'vitest';
import { ROLES } from '@/features/access/permissions';
import { PAGE_HEADS } from '@/features/shell/page-heads';
import { homeGreeting } from './intros';

// A phone takes the largest text painted as the page's main content. The home's pre-rendered head is
// painted at once; the greeting only after the JavaScript and the session. So the greeting, with a long
// first name, must stay well under the head's length (both are body text, wrapped at the same width):
// at most two thirds of it, so it wraps to fewer lines on a 360-412 px phone (our choice of margin).
describe('home greetings stay smaller than the pre-rendered head', () => {
  it.each(ROLES)('%s', (role) => {
    const greeting = homeGreeting('Maximiliana', role);
    expect(greeting.length).toBeLessThanOrEqual((PAGE_HEADS.home.text.length * 2) / 3);
  });
});
