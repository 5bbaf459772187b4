/**
 * Our own invented field records for the demo project (issue 15): one item of each way of paying. Names, trucks,
 * tickets and amounts are made up for the demo.
 */
export const DEMO_TRUCKS = [
  {
    label: 'H-07',
    hauler: 'Bitterroot Hauling',
    bedVolumeCy: 12.42,
    measuredBy: 'Owen Halvorsen',
    measuredOn: '2026-08-28',
  },
  {
    label: 'H-11',
    hauler: 'Bitterroot Hauling',
    bedVolumeCy: 14.86,
    measuredBy: 'Owen Halvorsen',
    measuredOn: '2026-08-28',
  },
  {
    label: 'D-3',
    hauler: 'Delgado Earthworks',
    bedVolumeCy: 10.95,
    measuredBy: 'Rosa Delgado',
    measuredOn: '2026-08-29',
  },
];

const HEADER = 'delivered_on,truck,material,source,loaded_at,delivered_to,load_checker,delivery_checker,load_volume_cy';
const row = (day: string, truck: string, volume = '') =>
  `${day},${truck},Unsuitable clay muck,Basin outlet cut,Basin outlet Sta 3+40,Spoil site B,RD,OH,${volume}`;
/** Haul-off loads of item 303 over three days; one load on a truck not yet on the register (flagged). */
export const DEMO_LOAD_SHEET = [
  HEADER,
  ...['H-07', 'H-11', 'D-3', 'H-07', 'H-11', 'D-3', 'H-07'].map((t) => row('2026-09-14', t)),
  ...['H-07', 'H-11', 'H-07', 'H-11', 'D-3'].map((t) => row('2026-09-15', t)),
  row('2026-09-15', 'H-19'),
  ...['H-07', 'H-11', 'D-3'].map((t) => row('2026-09-16', t)),
  row('2026-09-16', 'D-3', '10.40'),
].join('\n');

export const DEMO_SOURCE = {
  name: 'Cedar Flat quarry, 1 1/2 in base',
  weighedLoads: [
    { netTons: 21.36, volumeCy: 14.9 },
    { netTons: 22.08, volumeCy: 15.3 },
    { netTons: 20.94, volumeCy: 14.6 },
  ],
  statedMoisturePercent: 6,
};

/** Scale tickets of item 401 (aggregate base): gross, tare, moisture where it was measured. */
export const DEMO_SCALE_TICKETS = [
  { ticketNumber: 'CF-20931', weighedOn: '2026-10-06', grossTons: 36.42, tareTons: 14.88, moisturePercent: 4.8 },
  { ticketNumber: 'CF-20934', weighedOn: '2026-10-06', grossTons: 36.1, tareTons: 14.88, moisturePercent: null },
  { ticketNumber: 'CF-20940', weighedOn: '2026-10-06', grossTons: 35.77, tareTons: 14.52, moisturePercent: 7.9 },
  { ticketNumber: 'CF-20952', weighedOn: '2026-10-07', grossTons: 36.58, tareTons: 14.88, moisturePercent: 5.5 },
  { ticketNumber: 'CF-20957', weighedOn: '2026-10-07', grossTons: 35.93, tareTons: 14.52, moisturePercent: null },
];

export const DEMO_FORCE_ACCOUNT_ITEM = {
  itemNumber: 'FA-1',
  description: 'Extra work on time and materials: buried timber crib at the outlet',
  payUnit: 'LS' as const,
  basis: 'bank' as const,
  unitPriceCents: 1_500_000,
  contractQuantity: 1,
  isMajor: false,
  method: 'manual' as const,
};

export const DEMO_DAILY_SHEETS = [
  {
    workedOn: '2026-10-12',
    description: 'Dig out and haul away the buried timber crib found at the outlet structure',
    labor: [
      { trade: 'Equipment operator', hours: 8, rateCents: 6480 },
      { trade: 'Laborer', hours: 8, rateCents: 4215 },
      { trade: 'Truck driver', hours: 6.5, rateCents: 4890 },
    ],
    equipment: [
      { unit: 'Excavator, 24 t', hours: 7, rateCents: 16_850, standbyHours: 1, standbyRateCents: 8425 },
      { unit: 'Tandem dump truck', hours: 6.5, rateCents: 9_200, standbyHours: 0, standbyRateCents: 4_600 },
    ],
    materials: [{ description: 'Disposal fee, timber at the transfer station', invoiceCents: 38_640 }],
  },
  {
    workedOn: '2026-10-13',
    description: 'Backfill the crib void with select borrow and compact',
    labor: [
      { trade: 'Equipment operator', hours: 6, rateCents: 6480 },
      { trade: 'Laborer', hours: 6, rateCents: 4215 },
    ],
    equipment: [{ unit: 'Plate compactor', hours: 5, rateCents: 2_450, standbyHours: 0, standbyRateCents: 0 }],
    materials: [{ description: 'Select borrow, 42 t delivered', invoiceCents: 96_180 }],
  },
];
export const DEMO_MARKUPS = { laborPercent: 20, equipmentPercent: 15, materialPercent: 15 };

export const DEMO_STORED = {
  description: 'Class 2 riprap stone, stockpiled',
  unit: 'TON',
  unitCostCents: 4_150,
  neededQuantity: 420,
  storedAt: 'Stockpile west of the basin, on fabric',
};
export const DEMO_STORED_MOVES = [
  { kind: 'added' as const, movedOn: '2026-09-22', quantity: 180, invoiceRef: 'CF-INV-5512 (paid 2026-09-25)' },
  { kind: 'added' as const, movedOn: '2026-10-08', quantity: 160, invoiceRef: 'CF-INV-5587 (paid 2026-10-10)' },
  { kind: 'used' as const, movedOn: '2026-10-20', quantity: 95, invoiceRef: '' },
];
