import type { AccessRole, CompanyKind, MeasurementBasis, UnitSystem } from '@/shared/constants';

/** Words people read for the closed sets in src/shared/constants.ts. */
export const COMPANY_KIND_LABELS: Record<CompanyKind, string> = {
  subcontractor: 'Subcontractor',
  general_contractor: 'General contractor',
  owner: 'Owner',
};

export const ROLE_LABELS: Record<AccessRole, string> = {
  subcontractor: 'Subcontractor',
  general_contractor: 'General contractor',
  owner: 'Owner',
  subcontractor_admin: "Subcontractor's admin",
  general_contractor_admin: "General contractor's admin",
  owner_admin: "Owner's admin",
};

export const ROLE_TONES: Record<AccessRole, 'spruce' | 'clay' | 'neutral'> = {
  general_contractor: 'spruce',
  subcontractor: 'clay',
  owner: 'neutral',
  subcontractor_admin: 'neutral',
  general_contractor_admin: 'neutral',
  owner_admin: 'neutral',
};

export const BASIS_LABELS: Record<MeasurementBasis, string> = {
  bank: 'Bank',
  loose: 'Loose',
  compacted: 'Compacted',
};

export const UNIT_SYSTEM_LABELS: Record<UnitSystem, string> = {
  us: 'US customary',
  metric: 'Metric',
};
