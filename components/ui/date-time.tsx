const FORMAT = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

export function DateTime({ iso }: { iso: string }) {
  const date = new Date(iso);
  return <time dateTime={iso}>{Number.isNaN(date.getTime()) ? iso : FORMAT.format(date)}</time>;
}
