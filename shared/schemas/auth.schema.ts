import { z } from 'zod';
import { ROLES } from '../auth/roles.ts';

export const RoleSchema = z.enum(ROLES);

export const EmailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254)
  // One address, no display name, no CR/LF/comma: the same value later goes into mail headers.
  .email('must be an e-mail address')
  .refine((v) => !/[\r\n,;]/.test(v), 'must be a single address');

export const LoginRequest = z.strictObject({
  email: z.string().trim().toLowerCase().min(1, 'is required').max(254),
  // Length is checked by the password policy on set; on login any string is compared.
  password: z.string().min(1, 'is required').max(1024),
});
export type LoginRequest = z.infer<typeof LoginRequest>;

export const SessionUser = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: RoleSchema,
  workshopId: z.number(),
  workshopName: z.string(),
});
export type SessionUser = z.infer<typeof SessionUser>;

export const LoginResponse = z.object({ token: z.string(), user: SessionUser });
export type LoginResponse = z.infer<typeof LoginResponse>;

export const ChangePasswordRequest = z.strictObject({
  currentPassword: z.string().min(1, 'is required').max(1024),
  newPassword: z.string().min(1, 'is required').max(1024),
});
export type ChangePasswordRequest = z.infer<typeof ChangePasswordRequest>;

export const SetPasswordRequest = z.strictObject({
  token: z.string().min(20).max(200),
  password: z.string().min(1, 'is required').max(1024),
});
export type SetPasswordRequest = z.infer<typeof SetPasswordRequest>;
