/** Route ids arrive as text; anything but a positive whole number cannot name a record. */
export function parseId(value: string | undefined): number | null {
  if (!value || !/^[1-9]\d{0,9}$/.test(value)) return null;
  return Number(value);
}
