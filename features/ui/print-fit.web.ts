import { useEffect, useState } from 'react';
import { flushSync } from 'react-dom';

// A one-page report on paper (the squad trends'): its layout, and the scale that fits it to the page.
// Apart from print.web.ts, which every screen's first chunk carries, so that only the report loads it.

/**
 * A one-page report's layout on paper: the rows marked PRINT_FLOW give up their own box, so that what they
 * hold flows in the marked parent (PRINT_FLOW_PARENT): PRINT_FULL blocks take the page's width, PRINT_THIRD
 * blocks share a line three by three (the squad trends' table, then its three charts in one row).
 */
export const PRINT_FLOW_PARENT = { dataSet: { printFlowParent: 'true' } } as object;
export const PRINT_FLOW = { dataSet: { printFlow: 'true' } } as object;
export const PRINT_FULL = { dataSet: { printFull: 'true' } } as object;
export const PRINT_THIRD = { dataSet: { printThird: 'true' } } as object;

/** The paper layout's rules, applied in print and while the report is measured for it on screen. */
const flowRules = (scope: string) => `
  ${scope} [data-print-flow-parent] { flex-direction: row !important; flex-wrap: wrap !important; align-items: flex-start !important; }
  ${scope} [data-print-flow] { display: contents !important; }
  ${scope} [data-print-full] { flex: 0 0 100% !important; width: 100% !important; }
  ${scope} [data-print-third] { flex: 1 1 30% !important; min-width: 0 !important; }
  ${scope} [data-print-third] svg { max-width: 100%; height: auto; }`;

const CSS = `
@media print {
  /* Scaled to the page (useFitToOnePage). */
  [data-print-root][data-print-fit] { zoom: var(--print-zoom, 1); }
  ${flowRules('[data-print-root]')}
}
${flowRules('[data-print-measure]')}
/* While the report is measured for print, what print leaves out is left out of the measure. */
[data-print-measure] [data-print="hide"] { display: none !important; }`;

/** The printable area of an A4 landscape page less the 10 mm margins, in CSS pixels (96 per inch). */
export const PRINT_PAGE_PX = { width: Math.floor((277 / 25.4) * 96), height: Math.floor((190 / 25.4) * 96) };

/**
 * The largest zoom (at most 1: never enlarged; at least 0.4, our floor for legible print) at which a report
 * fits one page. At zoom z the report is laid out at the page's width / z and printed z times its size, so
 * it fits when heightAt(width / z) x z stays within the page's height, with 3 % to spare for what the
 * measure on screen misses (our choice). The height falls as the width grows (text wraps less), so a
 * bisection finds the zoom to within 1 % in seven layouts.
 */
export function fitZoom(heightAt: (width: number) => number, page = PRINT_PAGE_PX): number {
  const fits = (z: number) => heightAt(page.width / z) * z <= page.height * 0.97;
  if (fits(1)) return 1;
  let lo = 0.4;
  let hi = 1;
  if (!fits(lo)) return lo;
  for (let i = 0; i < 7; i++) {
    const mid = (lo + hi) / 2;
    if (fits(mid)) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * Before printing, lays the page's print region out on screen as it will be on paper (PRINT_FLOW, without
 * the controls print leaves out) at the widths `fitZoom` tries, and scales it to fit one page (the squad
 * trends' one-page report).
 */
export function useFitToOnePage(): void {
  useEffect(() => {
    if (!document.getElementById('squadline-print-fit-css')) {
      const style = document.createElement('style');
      style.id = 'squadline-print-fit-css';
      style.textContent = CSS;
      document.head.appendChild(style);
    }
    const before = () => {
      const root = document.querySelector<HTMLElement>('[data-print-root]');
      if (!root) return;
      // A zoom left from an earlier print would scale what is measured (a browser may announce one print
      // twice, or print again without saying it ended).
      delete root.dataset.printFit;
      root.style.removeProperty('--print-zoom');
      const width = root.style.width;
      root.dataset.printMeasure = 'true';
      const zoom = fitZoom((w) => {
        root.style.width = `${w}px`;
        return root.getBoundingClientRect().height;
      });
      delete root.dataset.printMeasure;
      root.style.width = width;
      root.style.setProperty('--print-zoom', String(zoom));
      root.dataset.printFit = 'true';
    };
    const after = () => {
      const root = document.querySelector<HTMLElement>('[data-print-root]');
      if (!root) return;
      delete root.dataset.printFit;
      root.style.removeProperty('--print-zoom');
    };
    window.addEventListener('beforeprint', before);
    window.addEventListener('afterprint', after);
    return () => {
      window.removeEventListener('beforeprint', before);
      window.removeEventListener('afterprint', after);
    };
  }, []);
}

/**
 * True while the page is being printed: a phone's layout (cards, one column) is drawn again in the wide
 * layout, at once (flushSync) so that the measure that follows (`useFitToOnePage`, whose listener a parent
 * registers later) sees it. Used by a child of the report.
 */
export function usePrinting(): boolean {
  const [printing, setPrinting] = useState(false);
  useEffect(() => {
    const before = () => flushSync(() => setPrinting(true));
    const after = () => setPrinting(false);
    window.addEventListener('beforeprint', before);
    window.addEventListener('afterprint', after);
    return () => {
      window.removeEventListener('beforeprint', before);
      window.removeEventListener('afterprint', after);
    };
  }, []);
  return printing;
}
