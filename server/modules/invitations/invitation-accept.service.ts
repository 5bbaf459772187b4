import { fromNodeHeaders } from 'better-auth/node';
import type { IncomingHttpHeaders } from 'node:http';
import type { AcceptInvitationInput, InvitationPreview } from '../../../src/shared/schemas/invitation';
import type { Auth } from '../../auth';
import type { Db } from '../../db/client';
import { companyMembers, projectMembers } from '../../db/schema';
import { AppError, conflict, forbidden, validationFailed } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { insertAccount, prepareAccount, type PreparedAccount } from '../accounts/accounts.service';
import { seatCompanyId } from '../../../src/shared/policies/projects';
import { memberRoles } from '../projects/projects.repository';
import { hashToken, TOKEN_SHAPE } from './invitation-token';
import { checkSeat } from './seat-rules';
import * as repo from './invitations.repository';

type Found = NonNullable<Awaited<ReturnType<typeof repo.findByTokenHash>>>;

/** The invitation of a token: 404 unknown or revoked, 409 already used, 410 expired. */
async function loadOpen(db: Db, token: string): Promise<Found> {
  const found = TOKEN_SHAPE.test(token) ? await repo.findByTokenHash(db, hashToken(token)) : undefined;
  if (!found)
    throw new AppError(404, 'INVITATION_NOT_FOUND', 'This invitation link is not valid. It may have been revoked.');
  if (found.invitation.acceptedAt)
    throw conflict('INVITATION_USED', 'This invitation was already accepted. Sign in to open the job.');
  if (found.invitation.expiresAt <= new Date()) {
    throw new AppError(
      410,
      'INVITATION_EXPIRED',
      'This invitation has expired. Ask the person who invited you for a new one.',
    );
  }
  return found;
}

export async function previewInvitation(db: Db, token: string): Promise<InvitationPreview> {
  const { invitation, projectName, invitedBy } = await loadOpen(db, token);
  return {
    projectName,
    role: invitation.role,
    email: invitation.email,
    invitedBy,
    expiresAt: invitation.expiresAt.toISOString(),
    hasAccount: Boolean(await repo.findUserByEmail(db, invitation.email)),
  };
}

/** A new person's account, checked and hashed before the transaction (accepting proves the address: the link was e-mailed to it). */
async function newAccount(auth: Auth, email: string, input: AcceptInvitationInput): Promise<PreparedAccount> {
  const problems = [];
  if (!input.name) problems.push({ path: 'name', message: 'Your name is required' });
  if (!input.password) problems.push({ path: 'password', message: 'Choose a password of at least 12 characters' });
  if (problems.length > 0) throw validationFailed(problems);
  return prepareAccount(auth, { email, name: input.name!, password: input.password!, emailVerified: true });
}

/** Signs the new person in through better-auth (its cookies come back to forward); nothing is lost if it fails. */
async function signInNew(auth: Auth, email: string, password: string, headers: IncomingHttpHeaders): Promise<string[]> {
  try {
    const { headers: out } = await auth.api.signInEmail({
      body: { email, password },
      headers: fromNodeHeaders(headers),
      returnHeaders: true,
    });
    return out.getSetCookie();
  } catch {
    return [];
  }
}

/**
 * Accepts an invitation: creates the account (name + password) or, when the e-mail already has one, requires
 * being signed in as it. The seat rules hold again here: a person of another company cannot take the seat, and
 * nobody takes a second seat on a job (409; a unique index on the project and person backs it against a race).
 * Adds the seat and, for a person without a company, the company that fills the seat.
 */
export async function acceptInvitation(
  db: Db,
  auth: Auth,
  token: string,
  input: AcceptInvitationInput,
  headers: IncomingHttpHeaders,
) {
  const found = await loadOpen(db, token);
  const { invitation, project } = found;
  const existing = await repo.findUserByEmail(db, invitation.email);
  let userId: string;
  let prepared: PreparedAccount | undefined;
  if (existing) {
    const session = await auth.api.getSession({ headers: fromNodeHeaders(headers) });
    if (!session)
      throw new AppError(401, 'UNAUTHENTICATED', `Sign in as ${invitation.email} to accept this invitation.`);
    if (session.user.id !== existing.id)
      throw forbidden(`This invitation is for ${invitation.email}; sign in as that person to accept it.`);
    userId = existing.id;
  } else {
    prepared = await newAccount(auth, invitation.email, input);
    userId = prepared.id;
  }
  if (existing) {
    const company = await repo.companyOf(db, userId);
    checkSeat(project, invitation.role, invitation.email, {
      companyId: company?.companyId ?? null,
      seats: await memberRoles(db, project.id, userId),
    });
  }
  await db.transaction(async (tx) => {
    if (!(await repo.markAccepted(tx, invitation.id)))
      throw conflict('INVITATION_USED', 'This invitation was already accepted.');
    if (prepared) await insertAccount(tx, prepared);
    const company = await repo.companyOf(tx, userId);
    checkSeat(project, invitation.role, invitation.email, {
      companyId: company?.companyId ?? null,
      seats: await memberRoles(tx, project.id, userId),
    });
    const inserted = await tx
      .insert(projectMembers)
      .values({ projectId: project.id, userId, role: invitation.role })
      .onConflictDoNothing()
      .returning();
    if (inserted.length === 0)
      throw conflict(
        'ALREADY_HOLDS_SEAT',
        `${invitation.email} already holds a seat on this job; one person holds one role on a job.`,
      );
    const joinedCompany = company ? null : seatCompanyId(project, invitation.role);
    if (joinedCompany) await tx.insert(companyMembers).values({ userId, companyId: joinedCompany, isAdmin: false });
    await recordAudit(tx, {
      projectId: project.id,
      actorUserId: userId,
      objectType: 'invitation',
      objectId: invitation.id,
      action: 'invitation.accepted',
      after: { email: invitation.email, role: invitation.role, newAccount: !existing, joinedCompanyId: joinedCompany },
    });
  });
  const setCookie = prepared ? await signInNew(auth, prepared.email, input.password!, headers) : [];
  return { projectId: project.id, setCookie };
}
