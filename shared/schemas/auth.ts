import { z } from 'zod';
import { departmentSchema, roleSchema } from './roles';

const email = z.string().trim().toLowerCase().max(254, 'at most 254 characters').pipe(z.email('not a valid e-mail address'));
const password = z.string().min(10, 'at least 10 characters').max(200, 'at most 200 characters');
const name = z.string().trim().min(1, 'required').max(120, 'at most 120 characters');

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

export const invitationCreateSchema = z.object({ email, role: roleSchema, department: departmentSchema });
export type InvitationCreateInput = z.infer<typeof invitationCreateSchema>;

export const membershipUpdateSchema = z.object({ role: roleSchema.optional(), department: departmentSchema.optional() });
export type MembershipUpdateInput = z.infer<typeof membershipUpdateSchema>;

export const productionCreateSchema = z.object({
  name: name,
  description: z.string().trim().max(2000, 'at most 2000 characters').default(''),
});
export const productionUpdateSchema = productionCreateSchema.partial();
export type ProductionCreateInput = z.infer<typeof productionCreateSchema>;

/** What GET /api/auth/me answers. */
export interface MeResponse {
  user: { id: number; email: string; name: string; isAdmin: boolean } | null;
  needsSetup: boolean;
  demo: boolean;
}
