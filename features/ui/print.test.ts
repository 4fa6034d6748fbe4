// The one-page report's scale. The page: A4 is 210 x 297 mm (ISO 216:2007, Writing paper and certain
// classes of printed matter: trimmed sizes, A and B series); a CSS pixel is 1/96 inch (W3C, CSS Values
// and Units Module Level 3, "absolute lengths"); the 10 mm margins and the 3 % to spare are our choice.
import { describe, expect, it } from 'vitest';
import { fitZoom, PRINT_PAGE_PX } from './print.web';

describe('fitting a report on one A4 landscape page', () => {
  it('the printable area: (297 - 20) mm by (210 - 20) mm at 96 px per 25.4 mm', () => {
    // 277 / 25.4 x 96 = 1046.9; 190 / 25.4 x 96 = 718.1 (by hand), rounded down.
    expect(PRINT_PAGE_PX).toEqual({ width: 1046, height: 718 });
  });

  it.each([
    ['a report that fits is never enlarged', 300, 1],
    ['exactly a page: 3 % to spare', 718, 0.97],
    ['twice a page: about half', 1436, 0.485],
    ['nothing measured: left as it is', 0, 1],
  ])('%s', (_name, height, zoom) => {
    expect(fitZoom(height)).toBeCloseTo(zoom, 6);
  });
});
