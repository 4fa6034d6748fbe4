// The one way Squadline writes a date on screen: as the user's locale writes it (the browser's or the
// phone's language), never as the stored YYYY-MM-DD. Pure: the locale can be passed for tests.

const DATE_ONLY = /^\d{4}-\d{2}-\d{2}$/;

// Building an Intl.DateTimeFormat costs far more than formatting with one (the browser resolves the
// locale's data each time): a list of rounds spent most of its own render time here. One per locale
// and set of options is kept.
const formatters = new Map<string, Intl.DateTimeFormat>();
function formatter(locale: string | undefined, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `${locale ?? ''}|${JSON.stringify(options)}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locale, options);
    formatters.set(key, f);
  }
  return f;
}

/**
 * A calendar date (`2026-09-14`) or a timestamp (`2026-09-14T08:30:00Z`) in the user's locale, for
 * example "14 Sept 2026" (en-GB), "Sep 14, 2026" (en-US), "14.09.2026" (de-DE, numeric). A calendar date
 * is a day, not an instant: it is shown as that day whatever the time zone. Unreadable input is returned
 * as it is rather than hidden.
 */
export function formatDate(value: string, options: { locale?: string; numeric?: boolean; longMonth?: boolean } = {}): string {
  const dateOnly = DATE_ONLY.test(value);
  const d = new Date(dateOnly ? `${value}T00:00:00Z` : value);
  if (Number.isNaN(d.getTime())) return value;
  return formatter(options.locale, {
    ...(options.numeric
      ? { day: '2-digit', month: '2-digit', year: 'numeric' }
      : { day: 'numeric', month: options.longMonth ? 'long' : 'short', year: 'numeric' }),
    ...(dateOnly ? { timeZone: 'UTC' } : {}),
  }).format(d);
}

/**
 * A date in words for text that leaves the app (an e-mail, a family summary kept as sent), where the
 * reader's locale is not known: day, month's name and year ("14 September 2026"), which no reader takes
 * for another day (our choice; 09/10 is read two ways).
 */
export const formatDateInWords = (value: string): string => formatDate(value, { locale: 'en-GB', longMonth: true });

/** A timestamp with its time of day, in the user's locale and time zone. */
export function formatDateTime(value: string, options: { locale?: string; timeZone?: string } = {}): string {
  const d = new Date(value);
  if (Number.isNaN(d.getTime())) return value;
  return formatter(options.locale, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    ...(options.timeZone ? { timeZone: options.timeZone } : {}),
  }).format(d);
}

/** The time of day of a timestamp ("14:05"), in the user's locale and time zone. */
export function formatTime(value: string, options: { locale?: string } = {}): string {
  const d = new Date(value);
  if (Number.isNaN(d.getTime())) return value;
  return formatter(options.locale, { hour: '2-digit', minute: '2-digit' }).format(d);
}
