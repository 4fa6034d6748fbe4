import { describe, expect, it, vi } from 'vitest';
import { browserConnectivity } from './connectivity';

// Our choice: a request with no answer at all counts as offline even where the browser says it is online
// (a hall's Wi-Fi with no way out), until the server answers again.
describe('connectivity', () => {
  it('is offline while the server cannot be reached, and says so to its listeners once per change', () => {
    const c = browserConnectivity();
    const heard = vi.fn();
    c.subscribe(heard);
    expect(c.isOnline()).toBe(true);
    c.setReachable(false);
    expect(c.isOnline()).toBe(false);
    c.setReachable(false);
    expect(heard).toHaveBeenCalledTimes(1);
    c.setReachable(true);
    expect(c.isOnline()).toBe(true);
    expect(heard).toHaveBeenCalledTimes(2);
  });
});
