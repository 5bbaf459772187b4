import { toast } from 'sonner';
import { Badge } from '@/components/ui/badge';
import { Select, optionsOf } from '@/components/ui/select';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { errorMessage } from '@/lib/api-client';
import { formatMoney } from '@/lib/format';
import { MEASUREMENT_PROFILES, MEASUREMENT_PROFILE_LABELS, type MeasurementProfile } from '@/shared/constants';
import { settingsFor, type MeasurementProfileView } from '@/shared/schemas/provisions/profile';
import { useProfiles, useSetProfile } from '../api/field-records';
import { RecordDialog } from './form-kit';
import { RegisterCard } from './section';
import { StageEditor } from './stage-editor';

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
                  {p.profile === 'lump_sum' ? <StagesLine profile={p} canSet={canSet} /> : null}
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

/** A lump sum's stage schedule in a few words, and (for the contract side) the editor. */
function StagesLine({ profile, canSet }: { profile: MeasurementProfileView; canSet: boolean }) {
  const stages = profile.settings.stages ?? [];
  const steps = profile.settings.mobilizationSteps ?? [];
  const done = stages.filter((s, i) => s.completedOn || profile.settings.completedStages?.includes(i)).length;
  const words =
    stages.length === 0
      ? 'No stage schedule: paid by percent complete.'
      : `${stages.length} stage${stages.length === 1 ? '' : 's'}, ${done} done.`;
  return (
    <div className="mt-1 flex flex-wrap items-center gap-2 text-xs text-stone-600">
      <span>{steps.length > 0 ? `Paid in ${steps.length} mobilization steps.` : words}</span>
      {canSet && steps.length === 0 ? (
        <RecordDialog
          command={stages.length === 0 ? 'Set up stages' : 'Edit stages'}
          title={`Stages of item ${profile.itemNumber}`}
          description="Name each stage, its share of the lump sum and the day it was done; the shares add up to 100 %."
        >
          {(close) => <StageEditor profile={profile} onDone={close} />}
        </RecordDialog>
      ) : null}
    </div>
  );
}
