/** Today in the local calendar, YYYY-MM-DD (the readings' and the prints' date). */
export function todayText(now: Date = new Date()): string {
  const two = (n: number): string => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${two(now.getMonth() + 1)}-${two(now.getDate())}`;
}
