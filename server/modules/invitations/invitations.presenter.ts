import type { InvitationView } from '../../../src/shared/schemas/invitation';
import type { InvitationRow } from './invitations.repository';

export function presentInvitation(row: InvitationRow, invitedBy: string, now = new Date()): InvitationView {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    state: row.acceptedAt ? 'accepted' : row.expiresAt <= now ? 'expired' : 'pending',
    invitedBy,
    expiresAt: row.expiresAt.toISOString(),
    acceptedAt: row.acceptedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}
