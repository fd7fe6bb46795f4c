/** A number the project document accepts where a finite value is meant: NaN and ±Infinity are refused by name. */
import { z } from 'zod';

export const finite = z.number().refine(Number.isFinite, 'expected a finite number');
