/*
 * Dates and times as the product shows them: in the reader's locale and time zone, with the zone
 * named, so "3 Dec 2026, 14:12 UTC" and "3 Dec 2026, 15:12 CET" are never taken for one another.
 * One home for the format; the screens reach it through components/ui/date-time.tsx.
 */

export interface DateTimeFormatOptions {
  /** BCP 47 locale; undefined means the runtime's (the browser's) own. */
  locale?: string;
  /** IANA time zone; undefined means the runtime's (the browser's) own. */
  timeZone?: string;
}

const FIELDS: Intl.DateTimeFormatOptions = {
  year: "numeric",
  month: "short",
  day: "numeric",
  hour: "2-digit",
  minute: "2-digit",
  timeZoneName: "short",
};

/** "3 Dec 2026, 14:12 UTC" (en-GB), "Dec 3, 2026, 09:12 AM EST" (en-US); the text itself when it is no date. */
export function formatDateTime(iso: string, options: DateTimeFormatOptions = {}): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return new Intl.DateTimeFormat(options.locale, { ...FIELDS, timeZone: options.timeZone }).format(date);
}

/** The time of day alone, with its zone: "14:12 UTC". */
export function formatTimeOfDay(date: Date, options: DateTimeFormatOptions = {}): string {
  return new Intl.DateTimeFormat(options.locale, {
    hour: "2-digit",
    minute: "2-digit",
    timeZoneName: "short",
    timeZone: options.timeZone,
  }).format(date);
}
