import { z } from 'zod';

/** Paging for every list: `{ items, total }` comes back. */
export const pageQuerySchema = z.object({
  page: z.coerce.number().int('page must be a whole number').min(1, 'page starts at 1').default(1),
  pageSize: z.coerce
    .number()
    .int('pageSize must be a whole number')
    .min(1, 'pageSize must be at least 1')
    .max(200, 'pageSize is at most 200')
    .default(25),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

export type Page<T> = { items: T[]; total: number };

export const uuidParam = z.string().uuid('not a valid id');

/** The one error shape the API answers with. */
export type ApiErrorBody = {
  error: { code: string; message: string; fields?: Record<string, string> };
};

export const emailSchema = z
  .string({ error: 'E-mail is required' })
  .trim()
  .toLowerCase()
  .min(1, 'E-mail is required')
  .email('Enter an e-mail address like name@example.org');

/** Long enough to resist guessing; better-auth enforces the same bounds on the server. */
export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 128;
export const passwordSchema = z
  .string({ error: 'Password is required' })
  .min(PASSWORD_MIN, `Password must be at least ${PASSWORD_MIN} characters`)
  .max(PASSWORD_MAX, `Password must be at most ${PASSWORD_MAX} characters`);
