import { z } from 'zod';
import { departmentSchema, roleSchema } from './roles';
import { nameText } from './names';

const email = z.string().trim().toLowerCase().max(254, 'at most 254 characters').pipe(z.email('not a valid e-mail address'));
const password = z.string().min(10, 'at least 10 characters').max(200, 'at most 200 characters');
/** a member's display name or a production's name: nothing invisible or direction-changing (names.ts) */
const name = nameText(120);

export const signInSchema = z.object({ email, password: z.string().min(1, 'required').max(200, 'at most 200 characters') });
export type SignInInput = z.infer<typeof signInSchema>;

/** The first account on an empty database (becomes site admin). */
export const setupSchema = z.object({ email, name, password });
export type SetupInput = z.infer<typeof setupSchema>;

export const acceptInvitationSchema = z.object({ name: name.optional(), password });
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

export const resetRequestSchema = z.object({ email });
export const resetConfirmSchema = z.object({ token: z.string().min(10, 'required').max(200), password });
export type ResetConfirmInput = z.infer<typeof resetConfirmSchema>;

/** A signed-in user changes their password (POST /api/auth/password). */
export const changePasswordSchema = z.object({ currentPassword: z.string().min(1, 'required').max(200, 'at most 200 characters'), newPassword: password });
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

/** One of the user's sessions as GET /api/auth/sessions lists it; `id` is an opaque handle, not the session id. */
export interface SessionInfo {
  id: string;
  createdAt: string;
  lastSeenAt: string;
  userAgent: string;
  ip: string;
  current: boolean;
}

export const invitationCreateSchema = z.object({ email, role: roleSchema, department: departmentSchema });
export type InvitationCreateInput = z.infer<typeof invitationCreateSchema>;

export const membershipUpdateSchema = z.object({ role: roleSchema.optional(), department: departmentSchema.optional() });
export type MembershipUpdateInput = z.infer<typeof membershipUpdateSchema>;

export const productionCreateSchema = z.object({
  name: name,
  description: z.string().trim().max(2000, 'at most 2000 characters').default(''),
});
/**
 * A change to a production: only the fields sent change. Built without the create schema's defaults, since
 * `.partial()` over a `.default('')` still fills the default in and a name-only PATCH wiped the description.
 */
export const productionUpdateSchema = z.object({
  name: name.optional(),
  description: z.string().trim().max(2000, 'at most 2000 characters').optional(),
});
export type ProductionCreateInput = z.infer<typeof productionCreateSchema>;

/** What GET /api/auth/me answers. */
export interface MeResponse {
  user: { id: number; email: string; name: string; isAdmin: boolean } | null;
  needsSetup: boolean;
  demo: boolean;
  /** demo mode switched on explicitly on a public address: the app shows a warning banner */
  demoPublic: boolean;
}
