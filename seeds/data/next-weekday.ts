/** The next Monday-to-Friday day after today (UTC), as YYYY-MM-DD: the demo's planned day. */
export function nextWeekday(): string {
  const d = new Date();
  do d.setUTCDate(d.getUTCDate() + 1);
  while (d.getUTCDay() === 0 || d.getUTCDay() === 6);
  return d.toISOString().slice(0, 10);
}
