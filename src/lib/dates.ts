// One way to show a moment: day, month and time, as the rest of the notebook writes them.
export function formatWhen(iso: string): string {
  return new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });
}
