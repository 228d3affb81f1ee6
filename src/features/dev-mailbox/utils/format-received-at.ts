const receivedFormat = new Intl.DateTimeFormat("en-GB", {
  day: "numeric",
  month: "short",
  hour: "2-digit",
  minute: "2-digit",
  second: "2-digit",
});

/** "2 Dec, 01:40:12": to the second, since messages of one test or workflow step arrive within a minute. */
export function formatReceivedAt(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? "—" : receivedFormat.format(date);
}
