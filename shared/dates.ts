/**
 * The one date format of Isobath: "3 Mar 2026" and "3 Mar 2026, 14:05" (en-GB, medium), on every
 * page and in the design record's PDF. The browser shows its own time zone; the PDF, made on the
 * server, says UTC.
 */
const formatters = new Map<string, Intl.DateTimeFormat>();
function formatter(withTime: boolean, timeZone: string | undefined): Intl.DateTimeFormat {
  const key = `${withTime}:${timeZone ?? ''}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', ...(withTime ? { timeStyle: 'short' } : {}), ...(timeZone ? { timeZone } : {}) });
    formatters.set(key, f);
  }
  return f;
}

/** "3 Mar 2026, 14:05"; an em dash when there is no date. */
export const formatDateTime = (iso: string | null | undefined, timeZone?: string) => (iso ? formatter(true, timeZone).format(new Date(iso)) : '—');
/** "3 Mar 2026"; an em dash when there is no date. */
export const formatDate = (iso: string | null | undefined, timeZone?: string) => (iso ? formatter(false, timeZone).format(new Date(iso)) : '—');
/** "3 Mar 2026, 14:05 UTC", for what the server writes (the record's PDF). */
export const formatDateTimeUtc = (iso: string | null | undefined) => (iso ? `${formatDateTime(iso, 'UTC')} UTC` : '—');
