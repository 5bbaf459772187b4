import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MeasurementProfileView, SetMeasurementProfileInput } from '@/shared/schemas/provisions/profile';
import type { CreateTruckInput } from '@/shared/schemas/provisions/tickets';
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
const list = <T>(projectId: string, path: string, pick: (body: never) => T) =>
  queryOptions({
    queryKey: fieldRecordKeys.of(projectId, path),
    queryFn: async () => pick(await api.get<never>(`/api/projects/${enc(projectId)}/${path}`)),
  });

export const profilesQuery = (projectId: string) =>
  list(projectId, 'measurement-profiles', (b: { profiles: MeasurementProfileView[] }) => b.profiles);
export const trucksQuery = (projectId: string) => list(projectId, 'trucks', (b: { trucks: TruckView[] }) => b.trucks);
export const truckTicketsQuery = (projectId: string) =>
  list(projectId, 'truck-tickets', (b: { tickets: TruckTicketView[]; totals: TicketTotalsView }) => b);
export const sourcesQuery = (projectId: string) =>
  list(projectId, 'material-sources', (b: { sources: MaterialSourceView[] }) => b.sources);
export const scaleTicketsQuery = (projectId: string) =>
  list(projectId, 'scale-tickets', (b: { tickets: ScaleTicketView[] }) => b.tickets);
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
