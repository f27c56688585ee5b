import { z } from 'zod';
import { EmailSchema, RoleSchema } from './auth.schema.ts';
import { requiredText } from './common.schema.ts';

export const UserSummary = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: RoleSchema,
  active: z.boolean(),
  /** Invited and has not set a password yet: cannot sign in. */
  invited: z.boolean(),
  createdAt: z.string(),
});
export type UserSummary = z.infer<typeof UserSummary>;

export const CreateUserRequest = z.strictObject({
  email: EmailSchema,
  name: requiredText(120),
  role: RoleSchema,
  /** Optional: without it the user gets an invitation to set their own password. */
  password: z.string().max(1024).optional(),
});
export type CreateUserRequest = z.infer<typeof CreateUserRequest>;

export const UpdateUserRequest = z
  .strictObject({
    name: requiredText(120).optional(),
    role: RoleSchema.optional(),
    active: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'give at least one of name, role, active');
export type UpdateUserRequest = z.infer<typeof UpdateUserRequest>;
