const localFormat = new Intl.DateTimeFormat("en-GB", {
  year: "numeric",
  month: "short",
  day: "2-digit",
  hour: "2-digit",
  minute: "2-digit",
  second: "2-digit",
  hour12: false,
  timeZoneName: "short",
});

/** A signing time in UTC, written the same way on every screen: "2025-03-05 14:07:12 UTC". */
export function formatUtc(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return `${date.toISOString().slice(0, 19).replace("T", " ")} UTC`;
}

/** The same moment in the viewer's own time zone, with the zone named. */
export function formatLocal(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : localFormat.format(date);
}
