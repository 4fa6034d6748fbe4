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
  /* What is not printed takes no room either: hidden but laid out, it ran on into blank pages. */
  #root *:has([data-print-root]) > :not(:has([data-print-root])):not([data-print-root]) { display: none !important; }
  body > :not(#root) { display: none !important; }
  html, body, #root { height: auto !important; min-height: 0 !important; }
  [data-print="hide"] { display: none !important; }
  [data-print-root] { font-size: 11px; }
  [data-print-keep] { break-inside: avoid; page-break-inside: avoid; }
  /* Rows of cards left half a page blank wherever the next row did not fit: on paper the cards flow down
     three columns instead, each whole, so a page fills. */
  [data-print-columns] { display: block !important; column-count: 3; column-gap: 6mm; }
  [data-print-columns] > * { display: block !important; width: auto !important; margin: 0 0 4mm 0 !important; }
  /* Denser cards on paper: two to a column instead of one (12 exercises on 4 pages, not 6). */
  [data-print-columns] div[dir] { font-size: 9.5px !important; line-height: 12px !important; }
  [data-print-columns] [data-print-keep] > * { padding: 6px !important; gap: 3px !important; }
  [data-print-columns] [data-print-keep] * { gap: 2px !important; min-height: 0 !important; }
}`;

export function installPrintCss(): void {
  if (document.getElementById('squadline-print-css')) return;
  const style = document.createElement('style');
  style.id = 'squadline-print-css';
  style.textContent = CSS;
  document.head.appendChild(style);
}
