import type { LazyRouteFunction, RouteObject } from 'react-router';

/** The tab bar's groups, in order: the contract, measuring the work, getting paid, the job's people and record. */
export const TAB_GROUPS = ['Contract', 'Measure', 'Pay', 'Job'] as const;
export type TabGroup = (typeof TAB_GROUPS)[number];

export type ProjectTab = {
  /** Path under /projects/:projectId; '' is the Overview. */
  path: string;
  label: string;
  group: TabGroup;
  /** The screen module; tabs without one show the "arrives with a later release" state. */
  screen?: LazyRouteFunction<RouteObject>;
  /** What the tab will hold, shown until it arrives. */
  summary: string;
};

/** The project tabs, in order and by group. Adding a tab is one entry here; the router and the nav read this list. */
export const PROJECT_TABS: readonly ProjectTab[] = [
  {
    path: '',
    group: 'Contract',
    label: 'Overview',
    screen: () => import('./routes/project-overview'),
    summary: 'Contract sum, companies and people.',
  },
  {
    path: 'bid-items',
    group: 'Contract',
    label: 'Bid schedule',
    screen: () => import('./routes/project-bid-items'),
    summary: 'The contract’s bid items.',
  },
  {
    path: 'change-orders',
    group: 'Contract',
    label: 'Change orders',
    screen: () => import('./routes/project-change-orders'),
    summary: 'Added items and changed quantities or unit prices, proposed and approved.',
  },
  {
    path: 'quantity-watch',
    group: 'Contract',
    label: 'Quantity watch',
    screen: () => import('./routes/project-quantity-watch'),
    summary: 'Forecast at completion against the contract quantity and the variation band.',
  },
  {
    path: 'tallies',
    group: 'Measure',
    label: 'Tallies',
    screen: () => import('./routes/project-tallies'),
    summary: 'Measured quantities per bid item and pay period, each backed by its worksheet and evidence.',
  },
  {
    path: 'worksheets',
    group: 'Measure',
    label: 'Worksheets',
    screen: () => import('./routes/project-worksheets'),
    summary: 'Cross sections, grid levels, pit corners, trench runs, truck tickets, spoil, surfaces and mass haul.',
  },
  {
    path: 'original-ground',
    group: 'Measure',
    label: 'Original ground',
    screen: () => import('./routes/project-baselines'),
    summary: 'The signed original ground surface each area measures from, with who accepted it and its SHA-256.',
  },
  {
    path: 'pay-basis',
    group: 'Measure',
    label: 'Pay basis',
    screen: () => import('./routes/project-pay-basis'),
    summary:
      'How each item is measured and paid, with its loads, scale tickets, time-and-materials days, stored materials and deductions.',
  },
  {
    path: 'pay-apps',
    group: 'Pay',
    label: 'Pay apps',
    screen: () => import('./routes/project-pay-apps'),
    summary: 'Monthly pay applications: submit, review line by line, certify, with retainage netted.',
  },
  {
    path: 'payments',
    group: 'Pay',
    label: 'Payments',
    screen: () => import('./routes/project-payments'),
    summary: 'Card and ACH payments of certified pay applications.',
  },
  {
    path: 'waivers',
    group: 'Pay',
    label: 'Waivers',
    screen: () => import('./routes/project-waivers'),
    summary: 'Conditional and unconditional lien waivers tied to payments.',
  },
  {
    path: 'people',
    group: 'Job',
    label: 'People',
    screen: () => import('./routes/project-people'),
    summary: 'Members, their roles, and invitations.',
  },
  {
    path: 'trail',
    group: 'Job',
    label: 'Trail',
    screen: () => import('./routes/project-trail'),
    summary: 'Every change on this job: who, when, what, before and after.',
  },
];
