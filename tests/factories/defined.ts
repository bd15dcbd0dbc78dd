/** The entries of `row` that are set: an option passed as undefined keeps the factory's default. */
export function defined<T extends object>(row: T): Partial<T> {
  return Object.fromEntries(Object.entries(row).filter(([, v]) => v !== undefined)) as Partial<T>;
}
