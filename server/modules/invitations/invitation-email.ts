import type { ProjectRole } from '../../../src/shared/constants';
import type { QueuedMail } from '../notifications/outbox';
import { layoutHtml, layoutText, PRODUCT_NAME, type EmailParts } from '../notifications/email-layout';

const ROLE_WORDS: Record<ProjectRole, string> = {
  subcontractor: 'the subcontractor',
  general_contractor: 'the general contractor',
  owner: 'the owner',
};

export type InvitationMailFacts = {
  projectId: string;
  projectName: string;
  role: ProjectRole;
  email: string;
  inviterName: string;
  acceptUrl: string;
  expiresAt: Date;
};

/** The invitation e-mail: who invites whom to which job, in which role, and the one-time accept link. */
export function invitationMail(f: InvitationMailFacts): QueuedMail {
  const expires = f.expiresAt.toISOString().slice(0, 10);
  const parts: EmailParts = {
    heading: `Join ${f.projectName}`,
    paragraphs: [
      `${f.inviterName} invited you to the job ${f.projectName} on ${PRODUCT_NAME}, for ${ROLE_WORDS[f.role]}.`,
      'Accept the invitation to see the bid schedule, tallies and pay applications of this job. If you have no account yet, you choose your password on the next page.',
    ],
    action: { href: f.acceptUrl, label: 'Accept the invitation' },
    footnote: `The link works once and expires on ${expires}. If you did not expect this e-mail, ignore it.`,
  };
  return {
    projectId: f.projectId,
    template: 'invitation',
    to: [f.email],
    subject: `${f.inviterName} invited you to ${f.projectName}`,
    text: layoutText(parts),
    html: layoutHtml(parts),
  };
}
