import { AdjustmentsCard, DailySheetsCard, StoredMaterialsCard } from './accounts-cards';
import { HaulCard } from './haul-card';
import { ProfilesCard } from './profiles-card';
import { ScaleCard } from './scale-card';

import type { ProjectCan } from '@/shared/policies/projects';

/** How each item is measured and paid, with the field records behind the quantities (`can` from the project). */
export function PayBasisScreen({ projectId, can }: { projectId: string; can: ProjectCan }) {
  return (
    <div className="flex flex-col gap-5">
      <ProfilesCard projectId={projectId} canSet={can.setMeasurementProfile} />
      <HaulCard projectId={projectId} canRecord={can.keepFieldRecords} />
      <ScaleCard projectId={projectId} canRecord={can.keepFieldRecords} />
      <DailySheetsCard projectId={projectId} canSign={can.signDailySheet} />
      <StoredMaterialsCard projectId={projectId} canRecord={can.keepFieldRecords} />
      <AdjustmentsCard projectId={projectId} canRecord={can.recordAdjustment} />
    </div>
  );
}
