// The one-page report's scale. The page: A4 is 210 x 297 mm (ISO 216:2007, Writing paper and certain
// classes of printed matter: trimmed sizes, A and B series); a CSS pixel is 1/96 inch (W3C, CSS Values
// and Units Module Level 3, "absolute lengths"); the 10 mm margins and the 3 % to spare are our choice.
import { describe, expect, it } from 'vitest';
import { fitZoom, PRINT_PAGE_PX } from './print-fit.web';

describe('fitting a report on one A4 landscape page', () => {
  it('the printable area: (297 - 20) mm by (210 - 20) mm at 96 px per 25.4 mm', () => {
    // 277 / 25.4 x 96 = 1046.9; 190 / 25.4 x 96 = 718.1 (by hand), rounded down.
    expect(PRINT_PAGE_PX).toEqual({ width: 1046, height: 718 });
  });

  // A made-up report: 2,000 px of text at 1,046 px wide that wraps less as it widens (height x width
  // constant), plus 200 px of charts that keep their height. Worked by hand: at zoom z it prints
  // (2,000 x 1,046 z / 1,046 + 200) z = 2,000 z^2 + 200 z px tall, which must stay within 0.97 x 718 =
  // 696.46 px: 2,000 z^2 + 200 z - 696.46 = 0 gives z = (-200 + sqrt(40,000 + 8 x 696.46 x 1,000)) / 4,000
  // = (-200 + 2,368.9) / 4,000 = 0.5422.
  const report = (width: number) => (2000 * 1046) / width + 200;

  it('finds the largest zoom that fits, within 1 %', () => {
    const z = fitZoom(report);
    expect(z).toBeLessThanOrEqual(0.5422);
    expect(z).toBeGreaterThan(0.5422 - 0.01);
  });

  it.each([
    ['a report that fits is never enlarged', () => 300, 1],
    ['one too tall even at the floor stays at the floor (0.4)', () => 5000, 0.4],
  ])('%s', (_name, heightAt, zoom) => {
    expect(fitZoom(heightAt)).toBe(zoom);
  });
});
