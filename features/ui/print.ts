// Print support lives in print.web.ts; native apps do not print from here.
/** Props that keep an element off the printed page (web: `data-print="hide"`). */
export const PRINT_HIDE = { dataSet: { print: 'hide' } } as object;
/** Props that mark the one region that is printed (web: `data-print-root`). */
export const PRINT_ROOT = { dataSet: { printRoot: 'true' } } as object;
/** A block kept on one printed page (an exercise with its athletes' names). */
export const PRINT_KEEP = { dataSet: { printKeep: 'true' } } as object;
/** Blocks that flow down three columns on paper, each kept whole (the training sheet's exercises). */
export const PRINT_COLUMNS = { dataSet: { printColumns: 'true' } } as object;
export function usePrintStyles(): void {}
export function printPage(): void {}
export const canPrint = false;
/** Opens a file download (native: hands the link to the system). */
export function downloadFile(url: string): void {
  void import('react-native').then(({ Linking }) => Linking.openURL(url));
}
