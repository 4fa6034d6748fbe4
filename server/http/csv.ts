import { stringify, type Options } from 'csv-stringify/sync';

/**
 * A cell a spreadsheet would run as a formula (text starting with =, +, -, @, a tab or a carriage return,
 * e.g. a name typed as "=HYPERLINK(...)" in a roster file) is written with a leading apostrophe, which
 * spreadsheets show as text. Numbers, negative ones included, are left as they are. The usual defence
 * against CSV injection (OWASP, "CSV Injection"; common practice, no source checked here).
 */
export function safeCell(value: unknown): unknown {
  if (typeof value !== 'string') return value;
  if (/^-?\d+(\.\d+)?$/.test(value)) return value;
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

/** csv-stringify with every cell made safe to open in a spreadsheet. */
export function safeCsv(rows: readonly (readonly unknown[])[], options?: Options): string {
  return stringify(
    rows.map((r) => r.map(safeCell)),
    options,
  );
}
