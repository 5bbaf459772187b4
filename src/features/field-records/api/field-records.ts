import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { fetchAllPages } from '@/lib/paging';
import type {
  MeasurementProfileView,
  SetLumpSumStagesInput,
  SetMeasurementProfileInput,
} from '@/shared/schemas/provisions/profile';
import type { CreateTruckInput } from '@/shared/schemas/provisions/tickets';
import type { ChangeOrderStatus } from '@/shared/constants';
import type {
  DailySheetView,
  MaterialSourceView,
  PayAdjustmentView,
  ScaleTicketView,
  StoredMaterialView,
  TicketTotalsView,
  TruckTicketView,
  TruckView,
} from '@/shared/schemas/provisions/views';

export const fieldRecordKeys = {
  all: ['field-records'] as const,
  of: (projectId: string, what: string) => [...fieldRecordKeys.all, projectId, what] as const,
};

const enc = encodeURIComponent;
/** A paged list (newest entry first) in the order the screens read: by a date, then in the order entered. */
const byDate = <T>(items: T[], dateOf: (t: T) => string): T[] =>
  items.reverse().sort((a, b) => dateOf(a).localeCompare(dateOf(b)));
const list = <T>(projectId: string, path: string, pick: (body: never) => T) =>
  queryOptions({
    queryKey: fieldRecordKeys.of(projectId, path),
    queryFn: async () => pick(await api.get<never>(`/api/projects/${enc(projectId)}/${path}`)),
  });

export const profilesQuery = (projectId: string) =>
  list(projectId, 'measurement-profiles', (b: { profiles: MeasurementProfileView[] }) => b.profiles);
export const trucksQuery = (projectId: string) => list(projectId, 'trucks', (b: { trucks: TruckView[] }) => b.trucks);
/** Every ticket (the list is paged; the screen shows all of them, by delivery date) and the totals over all. */
export const truckTicketsQuery = (projectId: string) =>
  queryOptions({
    queryKey: fieldRecordKeys.of(projectId, 'truck-tickets'),
    queryFn: async () => {
      const base = `/api/projects/${enc(projectId)}/truck-tickets`;
      const [tickets, { totals }] = await Promise.all([
        fetchAllPages<TruckTicketView>(base),
        api.get<{ totals: TicketTotalsView }>(`${base}/totals`),
      ]);
      return { tickets: byDate(tickets, (t) => t.deliveredOn), totals };
    },
  });
export const sourcesQuery = (projectId: string) =>
  list(projectId, 'material-sources', (b: { sources: MaterialSourceView[] }) => b.sources);
export const scaleTicketsQuery = (projectId: string) =>
  queryOptions({
    queryKey: fieldRecordKeys.of(projectId, 'scale-tickets'),
    queryFn: async () =>
      byDate(await fetchAllPages<ScaleTicketView>(`/api/projects/${enc(projectId)}/scale-tickets`), (t) => t.weighedOn),
  });
export const dailySheetsQuery = (projectId: string) =>
  list(projectId, 'daily-sheets', (b: { sheets: DailySheetView[] }) => b.sheets);
export const storedMaterialsQuery = (projectId: string) =>
  list(projectId, 'stored-materials', (b: { materials: StoredMaterialView[] }) => b.materials);
export const adjustmentsQuery = (projectId: string) =>
  list(projectId, 'pay-adjustments', (b: { adjustments: PayAdjustmentView[] }) => b.adjustments);

export const useProfiles = (projectId: string) => useQuery(profilesQuery(projectId));
export const useTrucks = (projectId: string) => useQuery(trucksQuery(projectId));
export const useTruckTickets = (projectId: string) => useQuery(truckTicketsQuery(projectId));
export const useSources = (projectId: string) => useQuery(sourcesQuery(projectId));
export const useScaleTickets = (projectId: string) => useQuery(scaleTicketsQuery(projectId));
export const useDailySheets = (projectId: string) => useQuery(dailySheetsQuery(projectId));
export const useStoredMaterials = (projectId: string) => useQuery(storedMaterialsQuery(projectId));
export const useAdjustments = (projectId: string) => useQuery(adjustmentsQuery(projectId));

export function useSetProfile() {
  return useMutation({
    mutationFn: async ({ bidItemId, ...input }: SetMeasurementProfileInput & { bidItemId: string }) =>
      (
        await api.put<{ profile: MeasurementProfileView }>(
          `/api/bid-items/${enc(bidItemId)}/measurement-profile`,
          input,
        )
      ).profile,
  });
}

/** Saves a lump-sum item's stage schedule (PUT /api/bid-items/:id/lump-sum-stages), answering its profile. */
export function useSetStages(bidItemId: string) {
  return useMutation({
    mutationFn: async (input: SetLumpSumStagesInput) =>
      (await api.put<{ profile: MeasurementProfileView }>(`/api/bid-items/${enc(bidItemId)}/lump-sum-stages`, input))
        .profile,
  });
}

export function useRegisterTruck(projectId: string) {
  return useMutation({
    mutationFn: async (input: CreateTruckInput) =>
      (await api.post<{ truck: TruckView }>(`/api/projects/${enc(projectId)}/trucks`, input)).truck,
  });
}

export function useImportTruckTickets(projectId: string) {
  return useMutation({
    mutationFn: async (input: { bidItemId: string; csv: string }) =>
      api.post<{ imported: number; flagged: number }>(`/api/projects/${enc(projectId)}/truck-tickets/import`, input),
  });
}

export function useSignDailySheet() {
  return useMutation({
    mutationFn: async (sheetId: string) =>
      (await api.post<{ sheet: DailySheetView }>(`/api/daily-sheets/${enc(sheetId)}/sign`)).sheet,
  });
}

/** The project's change orders, for choosing the one that authorised a force account day. */
export type ChangeOrderChoice = { id: string; number: number; title: string; status: ChangeOrderStatus };
export const changeOrderChoicesQuery = (projectId: string) =>
  list(projectId, 'change-orders', (b: { changeOrders: ChangeOrderChoice[] }) =>
    b.changeOrders.map(({ id, number, title, status }) => ({ id, number, title, status })),
  );
export const useChangeOrderChoices = (projectId: string) => useQuery(changeOrderChoicesQuery(projectId));

/** One POST of a field record to `path` under the project (or a full path), answering the record. */
function usePost<I, O>(path: (input: I) => string, pick: (body: never) => O) {
  return useMutation({
    mutationFn: async (input: I) => pick(await api.post<never>(path(input), stripRoute(input))),
  });
}
/** Route parameters travel in the path, never in the body (the server's schemas are strict). */
function stripRoute<I>(input: I): unknown {
  if (input && typeof input === 'object' && 'storedMaterialId' in input) {
    const { storedMaterialId: _id, ...rest } = input as Record<string, unknown>;
    return rest;
  }
  return input;
}
const under = (projectId: string, what: string) => () => `/api/projects/${enc(projectId)}/${what}`;

export const useRecordTruckTicket = (projectId: string) =>
  usePost(under(projectId, 'truck-tickets'), (b: { ticket: TruckTicketView }) => b.ticket);
export const useAddSource = (projectId: string) =>
  usePost(under(projectId, 'material-sources'), (b: { source: MaterialSourceView }) => b.source);
export const useRecordScaleTicket = (projectId: string) =>
  usePost(under(projectId, 'scale-tickets'), (b: { ticket: ScaleTicketView }) => b.ticket);
export const useRecordDailySheet = (projectId: string) =>
  usePost(under(projectId, 'daily-sheets'), (b: { sheet: DailySheetView }) => b.sheet);
export const useAddStoredMaterial = (projectId: string) =>
  usePost(under(projectId, 'stored-materials'), (b: { material: StoredMaterialView }) => b.material);
export const useAddStoredMovement = () =>
  usePost(
    (input: { storedMaterialId: string }) => `/api/stored-materials/${enc(input.storedMaterialId)}/movements`,
    (b: { material: StoredMaterialView }) => b.material,
  );
export const useRecordAdjustment = (projectId: string) =>
  usePost(under(projectId, 'pay-adjustments'), (b: { adjustment: PayAdjustmentView }) => b.adjustment);
