import { z } from 'zod';
import { FARM_ROLES, USER_ROLES, USER_STATUSES, type FarmRole, type UserRole, type UserStatus } from '../domain.js';
import { emailSchema, pageQuerySchema, passwordSchema } from './common.js';

export const signUpSchema = z.object({
  name: z.string({ error: 'Name is required' }).trim().min(2, 'Name must be at least 2 characters').max(120, 'Name is at most 120 characters'),
  email: emailSchema,
  password: passwordSchema,
  placeName: z.string().trim().max(200, 'Place is at most 200 characters').optional().default(''),
  application: z
    .string()
    .trim()
    .max(2000, 'Your note is at most 2000 characters')
    .optional()
    .default(''),
});
export type SignUpInput = z.input<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Password is required' }).min(1, 'Password is required'),
});

export const forgotPasswordSchema = z.object({ email: emailSchema });

export const resetPasswordSchema = z
  .object({ password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { message: 'The two passwords differ', path: ['confirm'] });

export const memberListQuerySchema = pageQuerySchema.extend({
  status: z.enum(USER_STATUSES, { error: 'status must be pending, active or suspended' }).optional(),
  q: z.string().trim().max(100, 'search is at most 100 characters').optional(),
});
export type MemberListQuery = z.infer<typeof memberListQuerySchema>;

/** What a coordinator may change about a member. */
export const memberPatchSchema = z
  .object({
    status: z.enum(USER_STATUSES, { error: 'status must be pending, active or suspended' }).optional(),
    role: z.enum(USER_ROLES, { error: 'role must be coordinator or member' }).optional(),
    reason: z.string().trim().max(500, 'reason is at most 500 characters').optional(),
  })
  .strict()
  .refine((v) => v.status !== undefined || v.role !== undefined, { message: 'Give a status or a role to change' });
export type MemberPatch = z.infer<typeof memberPatchSchema>;

export const farmMembershipSchema = z.object({
  farmRole: z.enum(FARM_ROLES, { error: 'farmRole must be lead or hand' }),
});

export type FarmLink = { farmId: string; farmName: string; farmCode: string; farmRole: FarmRole };

export type Member = {
  id: string;
  name: string;
  email: string;
  role: UserRole;
  status: UserStatus;
  placeName: string | null;
  application: string | null;
  createdAt: string;
  farms: FarmLink[];
};

/** GET /api/me */
export type Me = {
  user: { id: string; name: string; email: string; role: UserRole; status: UserStatus };
  farms: FarmLink[];
};
