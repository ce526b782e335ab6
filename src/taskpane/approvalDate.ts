/**
 * The approval date as a real calendar day. The engine's approveRuleset checks
 * the YYYY-MM-DD form with Date.parse, which rolls 2026-02-30 over to March
 * instead of refusing it; the pane refuses such a day itself.
 */
export function calendarDateProblem(text: string): string | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return `"${text}" is not a date written YYYY-MM-DD`;
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const date = new Date(Date.UTC(year, month - 1, day));
  if (date.getUTCFullYear() !== year || date.getUTCMonth() !== month - 1 || date.getUTCDate() !== day) return `"${text}" is not a day of the calendar`;
  return null;
}
