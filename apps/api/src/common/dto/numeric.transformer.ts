import type { ValueTransformer } from 'typeorm';

/** DECIMAL columns come back from mysql2 as strings; this keeps them numbers in entities. */
export const decimal: ValueTransformer = {
  to: (value: number | null | undefined) => value,
  from: (value: string | null) => (value === null || value === undefined ? null : Number(value)),
};
