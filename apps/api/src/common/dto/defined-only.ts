/**
 * The DTO's own properties that were sent. class-transformer leaves declared-but-absent properties as
 * `undefined`, which would otherwise overwrite defaults in a spread or mark a field as changed.
 */
export function definedOnly<T extends object>(dto: T): Partial<T> {
  return Object.fromEntries(Object.entries(dto).filter(([, v]) => v !== undefined)) as Partial<T>;
}
