import { toast } from 'sonner';
import { Badge } from '@/components/ui/badge';
import { Select, optionsOf } from '@/components/ui/select';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { errorMessage } from '@/lib/api-client';
import { formatMoney } from '@/lib/format';
import { MEASUREMENT_PROFILES, MEASUREMENT_PROFILE_LABELS, type MeasurementProfile } from '@/shared/constants';
import { settingsFor, type MeasurementProfileView } from '@/shared/schemas/provisions/profile';
import { useProfiles, useSetProfile } from '../api/field-records';
import { RegisterCard } from './section';

/** Each bid item's way of being measured and paid; the contract side changes it. */
export function ProfilesCard({ projectId, canSet }: { projectId: string; canSet: boolean }) {
  const query = useProfiles(projectId);
  const setProfile = useSetProfile();
  // The item's stage, precision and the settings the new profile reads are kept: a save never clears a lump
  // sum's stages or mobilization steps.
  const change = (p: MeasurementProfileView, profile: MeasurementProfile) =>
    setProfile.mutate(
      {
        bidItemId: p.bidItemId,
        profile,
        stage: p.stage,
        ...(p.isDefault || profile !== p.profile ? {} : { payDecimals: p.payDecimals }),
        settings: settingsFor(profile, p.settings),
      },
      {
        onSuccess: (p) => toast.success(`Item ${p.itemNumber}: ${p.profileLabel}`),
        onError: (e) => toast.error(errorMessage(e)),
      },
    );
  return (
    <RegisterCard
      title="How each item is paid"
      note="Measurements are kept one decimal finer than the pay quantity and stay interim until the final measurement."
      query={query}
    >
      {(profiles) => (
        <Table>
          <TableHead>
            <TableRow>
              <TableHeaderCell>Item</TableHeaderCell>
              <TableHeaderCell>Description</TableHeaderCell>
              <TableHeaderCell>Paid by</TableHeaderCell>
              <TableHeaderCell className="text-right">Pay to</TableHeaderCell>
              <TableHeaderCell>Stage</TableHeaderCell>
              <TableHeaderCell className="text-right">Earned from settings</TableHeaderCell>
            </TableRow>
          </TableHead>
          <TableBody>
            {profiles.map((p) => (
              <TableRow key={p.bidItemId}>
                <TableCell className="font-medium">{p.itemNumber}</TableCell>
                <TableCell>{p.description}</TableCell>
                <TableCell>
                  {canSet ? (
                    <Select
                      aria-label={`How item ${p.itemNumber} is paid`}
                      value={p.profile}
                      disabled={setProfile.isPending}
                      onChange={(e) => change(p, e.target.value as MeasurementProfile)}
                      options={optionsOf(MEASUREMENT_PROFILES, (k) => MEASUREMENT_PROFILE_LABELS[k])}
                    />
                  ) : (
                    p.profileLabel
                  )}
                </TableCell>
                <TableCell className="text-right tabular-nums">
                  {p.payDecimals === 0 ? '1' : `0.${'0'.repeat(p.payDecimals - 1)}1`} {p.payUnit}
                </TableCell>
                <TableCell>
                  <Badge tone={p.stage === 'final' ? 'spruce' : 'neutral'}>{p.stage}</Badge>
                </TableCell>
                <TableCell className="text-right tabular-nums">
                  {p.earnedCents === null ? '–' : formatMoney(p.earnedCents)}
                </TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      )}
    </RegisterCard>
  );
}
