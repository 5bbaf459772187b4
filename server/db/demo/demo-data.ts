import type { CompanyKind, ProjectRole } from '../../../src/shared/constants';
import type { BidItemInput } from '../../../src/shared/schemas/bid-item';
import type { ProjectSettings } from '../../../src/shared/schemas/project';

// The demo scenario is our own invention: fictional companies, people, site and prices.

export const DEMO_PASSWORD = 'tallyard-demo';

export const DEMO_COMPANIES: Record<CompanyKind, string> = {
  subcontractor: 'Redtail Earthworks LLC',
  general_contractor: 'Halvorsen & Pike Builders',
  owner: 'Millbrook Valley Parks District',
};

export type DemoPerson = {
  email: string;
  name: string;
  company: CompanyKind;
  isAdmin: boolean;
  projectRole: ProjectRole | null;
};

export const DEMO_PEOPLE: DemoPerson[] = [
  {
    email: 'sub@tallyard.test',
    name: 'Rosa Delgado',
    company: 'subcontractor',
    isAdmin: false,
    projectRole: 'subcontractor',
  },
  {
    email: 'gc@tallyard.test',
    name: 'Owen Halvorsen',
    company: 'general_contractor',
    isAdmin: false,
    projectRole: 'general_contractor',
  },
  { email: 'owner@tallyard.test', name: 'Priya Natarajan', company: 'owner', isAdmin: false, projectRole: 'owner' },
  {
    email: 'admin@tallyard.test',
    name: 'Dana Okafor',
    company: 'general_contractor',
    isAdmin: true,
    projectRole: null,
  },
];

export const DEMO_PROJECT: { name: string } & ProjectSettings = {
  name: 'Millbrook Commons: site grading and storm basin',
  location: 'Millbrook, OR (fictional site)',
  contractNumber: 'MVPD-2026-014',
  state: 'OR',
  units: 'us',
  retainageBps: 500,
  retainageReducedBps: 250,
  retainageReductionAtBps: 5000,
  variationPreset: 'far-15',
  bandOverBps: 1500,
  bandUnderBps: 1500,
  majorItemThresholdBps: 1000,
  paymentTermsDays: 30,
  allowPartialPayments: true,
  processingFeeBearer: 'payer',
  ownerApprovesChangeOrders: false,
  swellPercent: 25,
  shrinkagePercent: 10,
};

type Item = Omit<BidItemInput, 'isMajor'> & { isMajor?: boolean };
const item = (i: Item): BidItemInput => ({ isMajor: false, ...i });

export const DEMO_BID_ITEMS: BidItemInput[] = [
  item({
    itemNumber: '101',
    description: 'Mobilization',
    payUnit: 'LS',
    basis: 'bank',
    unitPriceCents: 4_250_000,
    contractQuantity: 1,
    method: 'manual',
  }),
  item({
    itemNumber: '201',
    description: 'Clearing and grubbing',
    payUnit: 'LS',
    basis: 'bank',
    unitPriceCents: 3_850_000,
    contractQuantity: 1,
    method: 'manual',
  }),
  item({
    itemNumber: '202',
    description: 'Topsoil strip and stockpile on site',
    payUnit: 'CY',
    basis: 'bank',
    unitPriceCents: 395,
    contractQuantity: 4_100,
    method: 'grid',
  }),
  item({
    itemNumber: '203',
    description: 'Unclassified excavation, building pad and roads',
    payUnit: 'CY',
    basis: 'bank',
    unitPriceCents: 685,
    contractQuantity: 18_400,
    method: 'end-area',
    isMajor: true,
  }),
  item({
    itemNumber: '204',
    description: 'Embankment in place, compacted',
    payUnit: 'CY',
    basis: 'compacted',
    unitPriceCents: 440,
    contractQuantity: 12_600,
    method: 'end-area',
    isMajor: true,
  }),
  item({
    itemNumber: '205',
    description: 'Borrow excavation, north borrow area',
    payUnit: 'CY',
    basis: 'bank',
    unitPriceCents: 975,
    contractQuantity: 3_200,
    method: 'grid',
  }),
  item({
    itemNumber: '206',
    description: 'Storm basin excavation',
    payUnit: 'CY',
    basis: 'bank',
    unitPriceCents: 720,
    contractQuantity: 9_850,
    method: 'surface',
    isMajor: true,
  }),
  item({
    itemNumber: '207',
    description: 'Outlet structure pit excavation',
    payUnit: 'CY',
    basis: 'bank',
    unitPriceCents: 1_450,
    contractQuantity: 260,
    method: 'pit',
  }),
  item({
    itemNumber: '301',
    description: 'Trench excavation, 18 in storm pipe, 0-10 ft deep',
    payUnit: 'LF',
    basis: 'bank',
    unitPriceCents: 1_850,
    contractQuantity: 2_340,
    method: 'trench',
  }),
  item({
    itemNumber: '302',
    description: 'Trench rock excavation',
    payUnit: 'CY',
    basis: 'bank',
    unitPriceCents: 8_500,
    contractQuantity: 180,
    method: 'trench',
  }),
  item({
    itemNumber: '303',
    description: 'Haul off unsuitable material',
    payUnit: 'CY',
    basis: 'loose',
    unitPriceCents: 1_425,
    contractQuantity: 1_500,
    method: 'load-count',
  }),
  item({
    itemNumber: '401',
    description: 'Aggregate base, 8 in',
    payUnit: 'TON',
    basis: 'compacted',
    unitPriceCents: 2_480,
    contractQuantity: 2_600,
    method: 'manual',
  }),
  item({
    itemNumber: '402',
    description: 'Fine grading, pads and swales',
    payUnit: 'SY',
    basis: 'bank',
    unitPriceCents: 135,
    contractQuantity: 21_500,
    method: 'manual',
  }),
  item({
    itemNumber: '501',
    description: 'Riprap at basin outlet, class 2',
    payUnit: 'TON',
    basis: 'loose',
    unitPriceCents: 6_200,
    contractQuantity: 420,
    method: 'manual',
  }),
  item({
    itemNumber: '502',
    description: 'Erosion control blanket',
    payUnit: 'SY',
    basis: 'bank',
    unitPriceCents: 260,
    contractQuantity: 3_800,
    method: 'manual',
  }),
  item({
    itemNumber: '503',
    description: 'Silt fence',
    payUnit: 'LF',
    basis: 'bank',
    unitPriceCents: 215,
    contractQuantity: 4_600,
    method: 'manual',
  }),
];
