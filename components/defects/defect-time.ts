/** Date and time as people in the fleet read them (Australian order, 24-hour clock). */
export function formatWhen(date: Date | string | number): string {
  const d = new Date(date);
  return d.toLocaleString("en-AU", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", hour12: false });
}
