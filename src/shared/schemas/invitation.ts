import { z } from 'zod';
import { PROJECT_ROLES, type ProjectRole } from '../constants';

/** Passwords as better-auth is configured (server/auth.ts MIN_PASSWORD_LENGTH). */
export const MIN_PASSWORD_LENGTH = 12;

export const createInvitationSchema = z
  .object({
    email: z.email('Type an e-mail address like name@company.com').trim().toLowerCase().max(254),
    role: z.enum(PROJECT_ROLES),
  })
  .strict();
export type CreateInvitationInput = z.infer<typeof createInvitationSchema>;

/** Accepting: a new person gives a name and a password; someone with an account signs in first and sends nothing. */
export const acceptInvitationSchema = z
  .object({
    name: z.string().trim().min(1, 'Your name is required').max(120).optional(),
    password: z.string().min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters`).max(128).optional(),
  })
  .strict();
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

export const INVITATION_STATES = ['pending', 'accepted', 'expired'] as const;
export type InvitationState = (typeof INVITATION_STATES)[number];

export type InvitationView = {
  id: string;
  email: string;
  role: ProjectRole;
  state: InvitationState;
  invitedBy: string;
  expiresAt: string;
  acceptedAt: string | null;
  createdAt: string;
};

/** What the public accept page shows about an invitation (by its token). */
export type InvitationPreview = {
  projectName: string;
  role: ProjectRole;
  email: string;
  invitedBy: string;
  expiresAt: string;
  hasAccount: boolean;
};
