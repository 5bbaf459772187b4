import type { PersonCan, ProjectCan } from '../policies/projects';
import { z } from 'zod';
import { ACCESS_ROLES, COMPANY_KINDS, FEE_BEARERS, PROJECT_ROLES, UNIT_SYSTEMS, VARIATION_PRESETS } from '../constants';

const percentBps = z.number().int().min(0).max(10_000);

/** Contract settings a general contractor may change after creation. */
export const projectSettingsSchema = z.object({
  location: z.string().trim().max(200),
  contractNumber: z.string().trim().max(100),
  state: z
    .string()
    .trim()
    .regex(/^([A-Z]{2})?$/, 'Use a two-letter state code, or leave it empty'),
  units: z.enum(UNIT_SYSTEMS),
  /** Retainage withheld on each line, in basis points (1000 = 10 %). */
  retainageBps: percentBps,
  /** Optional reduced retainage rate once the contract is this far complete. */
  retainageReducedBps: percentBps.nullable(),
  retainageReductionAtBps: percentBps.nullable(),
  variationPreset: z.enum(VARIATION_PRESETS),
  bandOverBps: percentBps,
  bandUnderBps: percentBps,
  /** A bid item is major when its original amount is at least this share of the original contract amount. */
  majorItemThresholdBps: percentBps,
  paymentTermsDays: z.number().int().min(0).max(365),
  allowPartialPayments: z.boolean(),
  /** Who bears card and ACH processing fees: the payer adds them to the charge, or the payee absorbs them. */
  processingFeeBearer: z.enum(FEE_BEARERS, { error: 'Choose payer or payee.' }),
  ownerApprovesChangeOrders: z.boolean(),
  /** Default material factors (editable defaults, common practice: common earth swells about 25 %). */
  swellPercent: z.number().finite().min(0).max(200),
  shrinkagePercent: z.number().finite().min(0).max(90),
});
export type ProjectSettings = z.infer<typeof projectSettingsSchema>;

export const PROJECT_DEFAULTS: ProjectSettings = {
  location: '',
  contractNumber: '',
  state: '',
  units: 'us',
  retainageBps: 1000,
  retainageReducedBps: null,
  retainageReductionAtBps: null,
  variationPreset: 'far-15',
  bandOverBps: 1500,
  bandUnderBps: 1500,
  majorItemThresholdBps: 1000,
  paymentTermsDays: 30,
  allowPartialPayments: false,
  processingFeeBearer: 'payee',
  ownerApprovesChangeOrders: false,
  swellPercent: 25,
  shrinkagePercent: 10,
};

const projectName = z.string().trim().min(1, 'Name is required').max(200);

export const createProjectSchema = projectSettingsSchema
  .partial()
  .extend({ name: projectName, subcontractorCompanyId: z.uuid(), ownerCompanyId: z.uuid() })
  .strict();
export type CreateProjectInput = z.infer<typeof createProjectSchema>;

export const updateProjectSchema = projectSettingsSchema
  .partial()
  .extend({ name: projectName.optional() })
  .strict()
  .refine((input) => Object.keys(input).length > 0, { message: 'Send at least one setting to change.' });
export type UpdateProjectInput = z.infer<typeof updateProjectSchema>;

export type CompanyView = { id: string; name: string; kind: (typeof COMPANY_KINDS)[number] };

export type ProjectMemberView = {
  userId: string;
  name: string;
  email: string;
  role: (typeof PROJECT_ROLES)[number];
  companyId: string | null;
  companyName: string | null;
};

/** A person of the signed-in admin's company (the company's own people list). */
export type CompanyMemberView = { userId: string; name: string; email: string; isAdmin: boolean };

/** GET /api/companies/:companyId (its admins only): the company, its people with their seats, open invitations. */
export type CompanyPageView = {
  company: CompanyView;
  people: (CompanyMemberView & {
    seats: { projectId: string; projectName: string; role: (typeof PROJECT_ROLES)[number] }[];
  })[];
  invitations: {
    id: string;
    email: string;
    role: (typeof PROJECT_ROLES)[number];
    projectId: string;
    projectName: string;
    invitedBy: string;
    sentAt: string;
    expiresAt: string;
    expired: boolean;
  }[];
};

export type ProjectSummaryView = {
  id: string;
  name: string;
  location: string;
  contractNumber: string;
  units: (typeof UNIT_SYSTEMS)[number];
  myRoles: (typeof ACCESS_ROLES)[number][];
  /** What the person may start on the project (src/shared/policies/projects.ts); screens read this, not myRoles. */
  can: ProjectCan;
  /** The seat whose people the signed-in admin invites and removes here (its own company's), or null. */
  managedSeat: (typeof PROJECT_ROLES)[number] | null;
  /** The bid schedule as set up, before any change order. */
  originalContractSumCents: number;
  /** Net of the approved change orders (current - original). */
  approvedChangesCents: number;
  /** The current contract sum: original + approved changes. */
  contractSumCents: number;
  /** Whether the contract is locked (a pay application was submitted): it then changes by change order only. */
  contractLocked: boolean;
  bidItemCount: number;
};

export type ProjectView = ProjectSummaryView &
  ProjectSettings & {
    companies: { subcontractor: CompanyView; generalContractor: CompanyView; owner: CompanyView };
    members: ProjectMemberView[];
    /** From certified applications: earned and retainage held to date (the latest one), and paid to date. */
    money: { earnedToDateCents: number; retainageHeldCents: number; paidToDateCents: number };
    createdAt: string;
    updatedAt: string;
  };

export type MeView = {
  user: { id: string; name: string; email: string };
  company: CompanyView | null;
  isAdmin: boolean;
  /** What the person may start outside any project (src/shared/policies/projects.ts). */
  can: PersonCan;
};

/** GET /api/session: whether the browser is signed in, and who (never a 401). */
export type SessionView = { signedIn: false } | { signedIn: true; me: MeView };
