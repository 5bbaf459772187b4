import { AdjustmentsCard, DailySheetsCard, StoredMaterialsCard } from './accounts-cards';
import { HaulCard } from './haul-card';
import { ProfilesCard } from './profiles-card';
import { ScaleCard } from './scale-card';

type Roles = readonly string[];

/** How each item is measured and paid, with the field records behind the quantities. */
export function PayBasisScreen({ projectId, myRoles }: { projectId: string; myRoles: Roles }) {
  const contractSide = myRoles.includes('general_contractor') || myRoles.includes('general_contractor_admin');
  const fieldSide = myRoles.includes('subcontractor') || myRoles.includes('general_contractor');
  return (
    <div className="flex flex-col gap-5">
      <ProfilesCard projectId={projectId} canSet={contractSide} />
      <HaulCard projectId={projectId} canRecord={fieldSide} />
      <ScaleCard projectId={projectId} canRecord={fieldSide} />
      <DailySheetsCard projectId={projectId} canSign={fieldSide} />
      <StoredMaterialsCard projectId={projectId} canRecord={fieldSide} />
      <AdjustmentsCard projectId={projectId} canRecord={contractSide} />
    </div>
  );
}
