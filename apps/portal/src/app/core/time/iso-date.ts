/** A local calendar date as `YYYY-MM-DD` (the form the API uses for dates without a time). */
export function toIsoDate(date: Date): string {
  const yyyy = String(date.getFullYear()).padStart(4, '0');
  const mm = String(date.getMonth() + 1).padStart(2, '0');
  const dd = String(date.getDate()).padStart(2, '0');
  return `${yyyy}-${mm}-${dd}`;
}

/** `toIsoDate` for form values: empty and invalid dates become ''. */
export function toIsoDateOrEmpty(value: unknown): string {
  return value instanceof Date && !Number.isNaN(value.getTime()) ? toIsoDate(value) : '';
}
