import { z } from 'zod';

/** E-mail addresses are compared and stored lower-case. */
export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'is too long')
  .pipe(z.email('is not a valid e-mail address'));

export const personNameSchema = z.string().trim().min(1, 'is required').max(120, 'is too long (at most 120 characters)');

/** Link tokens are checked by look-up, so any text is accepted here and unknown ones answer 404. */
export const linkTokenParams = z.object({ token: z.string().min(1).max(200) });

export const userIdParams = z.object({ userId: z.uuid('is not a valid id') });
