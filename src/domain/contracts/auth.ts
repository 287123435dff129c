import { z } from 'zod';
import { PRODUCTION_ROLES } from '../policy/index.ts';
import { paperSize, unitSystem } from './common.ts';

export const email = z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address.' }));
/** Long passphrases beat complexity rules (NIST SP 800-63B §5.1.1: at least 8, allow at least 64). */
export const newPassword = z.string().min(10, 'Use at least 10 characters.').max(200, 'Use at most 200 characters.');

export const signInBody = z.object({ email, password: z.string().min(1, 'Enter your password.').max(200) });
export type SignInBody = z.infer<typeof signInBody>;

export const productionRole = z.enum(PRODUCTION_ROLES);

export const membershipView = z.object({
  productionId: z.string(),
  productionName: z.string(),
  role: productionRole,
  venueIds: z.array(z.string()),
  paperSize,
});
export type MembershipView = z.infer<typeof membershipView>;

export const sessionUser = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
  units: unitSystem,
  memberships: z.array(membershipView),
});
export type SessionUser = z.infer<typeof sessionUser>;

export const preferencesBody = z.object({ units: unitSystem });
export const changePasswordBody = z.object({ currentPassword: z.string().min(1).max(200), newPassword });
export const resetRequestBody = z.object({ email });
export const resetCompleteBody = z.object({ token: z.string().min(20).max(200), password: newPassword });
export const acceptInvitationBody = z.object({ name: z.string().trim().min(1, 'Enter your name.').max(120), password: newPassword });

export const invitationBody = z.object({
  email,
  name: z.string().trim().min(1, 'Enter a name.').max(120),
  isAdmin: z.boolean().default(false),
  membership: z
    .object({ productionId: z.string().uuid(), role: productionRole, venueIds: z.array(z.string().uuid()).default([]) })
    .optional(),
});
export type InvitationBody = z.infer<typeof invitationBody>;

export const membershipBody = z.object({
  userId: z.string().uuid(),
  role: productionRole,
  venueIds: z.array(z.string().uuid()).default([]),
});
