import { useEffect } from 'react';

export const PRINT_HIDE = { dataSet: { print: 'hide' } } as object;
export const PRINT_ROOT = { dataSet: { printRoot: 'true' } } as object;
/** A block kept on one printed page (an exercise with its athletes' names). */
export const PRINT_KEEP = { dataSet: { printKeep: 'true' } } as object;
/** Blocks that flow down three columns on paper, each kept whole (the training sheet's exercises). */
export const PRINT_COLUMNS = { dataSet: { printColumns: 'true' } } as object;
/**
 * Installs the print rules (features/ui/print-css.web.ts), loaded on their own when a printable report
 * opens: they are not part of every screen's first chunk.
 */
export function usePrintStyles(): void {
  useEffect(() => {
    void import('./print-css').then((m) => m.installPrintCss());
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
