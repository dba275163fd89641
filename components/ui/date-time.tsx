"use client";

import { useSyncExternalStore } from "react";
import { formatDateTime } from "@/lib/text/date-time";

const noSubscription = () => () => undefined;

/**
 * A date in the reader's locale and time zone. The server does not know either, so the server's
 * HTML (and the first render in the browser, which must match it) shows the time in UTC, named as
 * such; once in the browser the reader's own format replaces it. The exact instant is the title.
 */
export function DateTime({ iso }: { iso: string }) {
  const inBrowser = useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
  const text = inBrowser ? formatDateTime(iso) : formatDateTime(iso, { locale: "en-GB", timeZone: "UTC" });
  return (
    <time dateTime={iso} title={iso}>
      {text}
    </time>
  );
}
