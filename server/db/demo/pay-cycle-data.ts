// The demo pay cycle is our own invention: fictional survey numbers, truck tickets and dates.

export type DemoTally = {
  itemNumber: string;
  measuredOn: string;
  title: string;
  method: 'end-area' | 'grid' | 'trench' | 'load-count' | 'manual';
  inputs?: Record<string, unknown>;
  /** Cut-and-fill worksheets: the part this tally bills. */
  component?: 'cut' | 'fill';
  quantity?: number;
  manualBasis?: string;
  /** A small evidence file of our own making: its name and CSV text. */
  evidence?: { fileName: string; csv: string };
};

export type DemoPeriod = { periodStart: string; periodEnd: string; tallies: DemoTally[] };

const sections = (stations: [number, number, number][]) => ({
  unit: 'ft',
  stations: stations.map(([station, cutArea, fillArea]) => ({ station, cutArea, fillArea })),
});
const sectionsCsv = (stations: [number, number, number][]) =>
  ['station_ft,cut_area_sf,fill_area_sf', ...stations.map((s) => s.join(','))].join('\n') + '\n';
const ticketsCsv = (loads: { capacity: number; count: number }[], day: string) =>
  ['date,truck_body_lcy,loads', ...loads.map((l) => `${day},${l.capacity},${l.count}`)].join('\n') + '\n';

const road1: [number, number, number][] = [
  [1000, 210, 0],
  [1100, 265, 0],
  [1200, 240, 30],
  [1300, 180, 95],
];
const road2: [number, number, number][] = [
  [1300, 180, 95],
  [1400, 150, 160],
  [1500, 95, 210],
  [1600, 60, 240],
];
const road3: [number, number, number][] = [
  [1600, 60, 240],
  [1700, 120, 175],
  [1800, 205, 60],
  [1900, 230, 0],
];
const topsoil = {
  unit: 'ft',
  spacingX: 50,
  spacingY: 50,
  depths: [
    [0.5, 0.6, 0.55, 0.5],
    [0.6, 0.7, 0.65, 0.55],
    [0.55, 0.65, 0.7, 0.6],
    [0.5, 0.55, 0.6, 0.5],
  ],
};
const haul2 = [
  { capacity: 14, count: 22 },
  { capacity: 18, count: 9 },
];
const haul3 = [
  { capacity: 14, count: 27 },
  { capacity: 18, count: 12 },
];

export const DEMO_PAY_CYCLE: DemoPeriod[] = [
  {
    periodStart: '2026-08-01',
    periodEnd: '2026-08-31',
    tallies: [
      {
        itemNumber: '101',
        measuredOn: '2026-08-07',
        title: 'Mobilization complete',
        method: 'manual',
        quantity: 1,
        manualBasis:
          'Equipment on site and the field office set, per the mobilization clause (paid in full once mobilized).',
      },
      {
        itemNumber: '201',
        measuredOn: '2026-08-20',
        title: 'Clearing and grubbing, whole site',
        method: 'manual',
        quantity: 1,
        manualBasis: 'Clearing limits walked with the general contractor on Aug 20; all areas cleared and grubbed.',
      },
      {
        itemNumber: '202',
        measuredOn: '2026-08-24',
        title: 'Topsoil strip, pad area grid',
        method: 'grid',
        inputs: topsoil,
        evidence: {
          fileName: 'topsoil-grid-depths.csv',
          csv:
            ['row,col,depth_ft', ...topsoil.depths.flatMap((r, i) => r.map((d, j) => `${i},${j},${d}`))].join('\n') +
            '\n',
        },
      },
      {
        itemNumber: '203',
        measuredOn: '2026-08-28',
        title: 'Road A cut, sta 10+00 to 13+00',
        method: 'end-area',
        inputs: sections(road1),
        evidence: { fileName: 'road-a-sections-1000-1300.csv', csv: sectionsCsv(road1) },
      },
      {
        itemNumber: '503',
        measuredOn: '2026-08-12',
        title: 'Silt fence, north and east lines',
        method: 'manual',
        quantity: 2450,
        manualBasis: 'Measured with a wheel along the installed fence, north line 1,310 ft and east line 1,140 ft.',
      },
    ],
  },
  {
    periodStart: '2026-09-01',
    periodEnd: '2026-09-30',
    tallies: [
      {
        itemNumber: '203',
        measuredOn: '2026-09-18',
        title: 'Road A cut, sta 13+00 to 16+00',
        method: 'end-area',
        inputs: sections(road2),
        evidence: { fileName: 'road-a-sections-1300-1600.csv', csv: sectionsCsv(road2) },
      },
      {
        itemNumber: '204',
        measuredOn: '2026-09-25',
        title: 'Road A fill, sta 12+00 to 16+00',
        method: 'end-area',
        component: 'fill',
        inputs: sections(road2),
        evidence: { fileName: 'road-a-fill-sections.csv', csv: sectionsCsv(road2) },
      },
      {
        itemNumber: '302',
        measuredOn: '2026-09-11',
        title: 'Rock in the storm trench, run S-2',
        method: 'trench',
        inputs: { unit: 'ft', protection: 'box', runs: [{ length: 60, depth: 3, bottomWidth: 3 }] },
      },
      {
        itemNumber: '303',
        measuredOn: '2026-09-22',
        title: 'Unsuitable hauled off, week of Sep 21',
        method: 'load-count',
        inputs: { swellPercent: 25, loads: haul2 },
        evidence: { fileName: 'truck-tickets-sep.csv', csv: ticketsCsv(haul2, '2026-09-22') },
      },
    ],
  },
  {
    periodStart: '2026-10-01',
    periodEnd: '2026-10-31',
    tallies: [
      {
        itemNumber: '203',
        measuredOn: '2026-10-21',
        title: 'Road A cut, sta 16+00 to 19+00',
        method: 'end-area',
        inputs: sections(road3),
        evidence: { fileName: 'road-a-sections-1600-1900.csv', csv: sectionsCsv(road3) },
      },
      {
        itemNumber: '204',
        measuredOn: '2026-10-23',
        title: 'Road A fill, sta 16+00 to 18+00',
        method: 'end-area',
        component: 'fill',
        inputs: sections(road3),
      },
      {
        itemNumber: '303',
        measuredOn: '2026-10-14',
        title: 'Unsuitable hauled off, October',
        method: 'load-count',
        inputs: { swellPercent: 25, loads: haul3 },
        evidence: { fileName: 'truck-tickets-oct.csv', csv: ticketsCsv(haul3, '2026-10-14') },
      },
    ],
  },
];

/** The dispute on period 3: the reviewer counts fewer loads on the tickets than billed. */
export const DEMO_DISPUTE = {
  itemNumber: '303',
  reason:
    'Tickets 4471 to 4475 are for the north borrow haul, not unsuitable; we count 34 loads of unsuitable, not 39.',
  counterQuantityShare: 0.87,
};

/** Forecasts at completion the subcontractor keeps: item 203 runs beyond the FAR 52.211-18 band, 204 is close. */
export const DEMO_FORECASTS = [
  {
    itemNumber: '203',
    forecastQuantity: 21_700,
    note: 'Rock lens east of sta 17+00 is being undercut and replaced; resurvey planned.',
  },
  { itemNumber: '204', forecastQuantity: 14_200, note: 'Extra fill to replace the undercut below Road A.' },
];

/**
 * The approved change order of the demo, between periods 2 and 3: the north borrow area grows by 1,600 CY and
 * nine days of dewatering at the basin are added as a new item paid by the day.
 */
export const DEMO_CHANGE_ORDER = {
  title: 'North borrow extension and basin dewatering',
  reason:
    'The embankment needs more borrow than planned after the undercut below Road A; groundwater met at the basin floor needs pumping (field memo FM-07).',
  approvalNote: 'Checked against the revised borrow survey and the pump log.',
};

export const demoChangeOrder = (itemIds: Map<string, string>) => ({
  title: DEMO_CHANGE_ORDER.title,
  reason: DEMO_CHANGE_ORDER.reason,
  items: [
    { kind: 'change_quantity' as const, bidItemId: itemIds.get('205')!, quantityDelta: 1_600 },
    {
      kind: 'add_item' as const,
      newItem: {
        itemNumber: '208',
        description: 'Dewatering at the storm basin, pump and hoses',
        payUnit: 'DAY' as const,
        basis: 'bank' as const,
        unitPriceCents: 185_000,
        contractQuantity: 9,
        isMajor: false,
        method: 'manual' as const,
      },
    },
  ],
});
