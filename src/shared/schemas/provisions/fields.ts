import { z } from 'zod';
import { roundTo } from '../../domain/rounding';

/** A number with at most `decimals` decimals, from `min` to `max` (finite). */
export function decimalField(decimals: number, min: number, max: number, what = 'A value') {
  return z
    .number()
    .finite()
    .min(min, `${what} cannot be below ${min}`)
    .max(max, `${what} cannot be above ${max}`)
    .refine((v) => roundTo(v, decimals) === v, `${what} has at most ${decimals} decimals`);
}

export const textField = (max = 200, what = 'This') => z.string().trim().min(1, `${what} is required`).max(max);
/** A checker's initials: 1 to 4 letters. */
export const initialsField = z
  .string()
  .trim()
  .regex(/^[A-Za-z]{1,4}$/, 'Initials are 1 to 4 letters');
export const percentField = decimalField(2, 0, 100, 'A percent');
export const centsField = z.number().int('Money is whole cents').min(0).max(1e13);
