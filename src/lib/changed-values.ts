/**
 * The values of the fields a person actually changed, as react-hook-form marks them dirty. An
 * edit sends only these, so a PATCH never rewrites a field someone else changed meanwhile.
 */
export function changedValues<T extends object>(values: T, dirtyFields: Partial<Record<keyof T, unknown>>): Partial<T> {
  return Object.fromEntries(Object.entries(values).filter(([key]) => dirtyFields[key as keyof T])) as Partial<T>;
}
