import { describe, expect, it } from "vitest";
import { formatDateTime, formatTimeOfDay } from "@/lib/text/date-time";

describe("formatDateTime", () => {
  const iso = "2026-12-03T14:12:00.000Z";

  it("names the time zone and converts into it", () => {
    expect(formatDateTime(iso, { locale: "en-GB", timeZone: "UTC" })).toBe("3 Dec 2026, 14:12 UTC");
    // Europe/Berlin is UTC+1 in December (no summer time).
    expect(formatDateTime(iso, { locale: "en-GB", timeZone: "Europe/Berlin" })).toMatch(/^3 Dec 2026, 15:12 (CET|GMT\+1)$/);
  });

  it("follows the locale's order and clock", () => {
    // New York is UTC−5 in December.
    expect(formatDateTime(iso, { locale: "en-US", timeZone: "America/New_York" })).toMatch(/^Dec 3, 2026, 09:12 AM (EST|GMT-5)$/);
    expect(formatDateTime(iso, { locale: "de-DE", timeZone: "UTC" })).toMatch(/^0?3\. Dez\. 2026, 14:12 UTC$/);
  });

  it("crosses the date line with the zone", () => {
    // Auckland is UTC+13 in December (daylight time): already the 4th.
    expect(formatDateTime("2026-12-03T14:12:00Z", { locale: "en-GB", timeZone: "Pacific/Auckland" })).toMatch(/^4 Dec 2026, 03:12/);
  });

  it("returns text that is not a date unchanged", () => {
    expect(formatDateTime("yesterday")).toBe("yesterday");
  });
});

describe("formatTimeOfDay", () => {
  it("gives hours and minutes with the zone", () => {
    expect(formatTimeOfDay(new Date("2026-12-03T14:12:00Z"), { locale: "en-GB", timeZone: "UTC" })).toBe("14:12 UTC");
  });
});
