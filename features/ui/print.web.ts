import { useEffect } from 'react';

export const PRINT_HIDE = { dataSet: { print: 'hide' } } as object;
export const PRINT_ROOT = { dataSet: { printRoot: 'true' } } as object;
/** A block kept on one printed page (an exercise with its athletes' names). */
export const PRINT_KEEP = { dataSet: { printKeep: 'true' } } as object;

/**
 * Printable reports (the squad trends' one page, the training sheet): only the region marked PRINT_ROOT
 * is printed, controls marked PRINT_HIDE are left out, scrolling containers are unrolled, on A4 landscape.
 */
const CSS = `
@media print {
  @page { size: A4 landscape; margin: 10mm; }
  html, body, #root, #root * { overflow: visible !important; }
  body * { visibility: hidden; }
  [data-print-root], [data-print-root] * { visibility: visible; }
  /* Every view is position: relative on the web, and the screen's stack moves its pages with a transform;
     the report's ancestors give both up so that it starts at the page's left edge, not beside the hidden
     side navigation. */
  #root *:has([data-print-root]) { position: static !important; transform: none !important; will-change: auto !important; contain: none !important; filter: none !important; }
  [data-print-root] { position: absolute; left: 0; top: 0; width: 100%; }
  [data-print="hide"] { display: none !important; }
  [data-print-root] { font-size: 11px; }
  [data-print-keep] { break-inside: avoid; page-break-inside: avoid; }
  /* A one-page report (useFitToOnePage) is scaled to the page, and widened to fill it at that scale. */
  [data-print-root][data-print-fit] { zoom: var(--print-zoom, 1); width: calc(100% / var(--print-zoom, 1)); }
}
/* While a one-page report is measured for print, what print leaves out is left out of the measure. */
[data-print-measure] [data-print="hide"] { display: none !important; }`;

/** The printable area of an A4 landscape page less the 10 mm margins, in CSS pixels (96 per inch). */
export const PRINT_PAGE_PX = { width: Math.floor((277 / 25.4) * 96), height: Math.floor((190 / 25.4) * 96) };

/**
 * The zoom that brings a report of `height` CSS pixels (laid out at the page's width) onto one page: at
 * most 1 (never enlarged), with 3 % to spare for what the measure on screen misses (our choice).
 */
export function fitZoom(height: number, pageHeight = PRINT_PAGE_PX.height): number {
  if (!(height > 0)) return 1;
  return Math.min(1, (pageHeight / height) * 0.97);
}

/**
 * Before printing, lays the page's print region out at the page's width on screen, measures its height
 * without the controls print leaves out, and scales it to fit one page (the squad trends' one-page report).
 */
export function useFitToOnePage(): void {
  useEffect(() => {
    const before = () => {
      const root = document.querySelector<HTMLElement>('[data-print-root]');
      if (!root) return;
      const width = root.style.width;
      root.style.width = `${PRINT_PAGE_PX.width}px`;
      root.dataset.printMeasure = 'true';
      const zoom = fitZoom(root.getBoundingClientRect().height);
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

export function usePrintStyles(): void {
  useEffect(() => {
    if (document.getElementById('squadline-print-css')) return;
    const style = document.createElement('style');
    style.id = 'squadline-print-css';
    style.textContent = CSS;
    document.head.appendChild(style);
  }, []);
}

export function printPage(): void {
  window.print();
}
export const canPrint = true;

/** Downloads a file through a link with `download`, so the page stays where it is. */
export function downloadFile(url: string): void {
  const a = document.createElement('a');
  a.href = url;
  a.download = '';
  document.body.appendChild(a);
  a.click();
  a.remove();
}
