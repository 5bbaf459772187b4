import { LoadingState } from '@/components/ui/states';
import type { MeasurementProfileView } from '@/shared/schemas/provisions/profile';
import { createTruckSchema, createTruckTicketSchema } from '@/shared/schemas/provisions/tickets';
import { useProfiles, useRecordTruckTicket, useRegisterTruck } from '../api/field-records';
import { FormFooter, numberText, optionalNumberText, saved, SelectBox, TextBox, useRecordForm } from './form-kit';

const truck = createTruckSchema.shape;
const truckFormSchema = createTruckSchema.extend({ bedVolumeCy: numberText(truck.bedVolumeCy, 'Bed volume') });
const TRUCK_LABELS = {
  label: 'Truck number',
  hauler: 'Hauler',
  bedVolumeCy: 'Bed volume',
  measuredBy: 'Measured by',
  measuredOn: 'Measured on',
};

/** Puts a truck on the register with its measured bed, before it hauls. */
export function TruckForm({ projectId, onDone }: { projectId: string; onDone: () => void }) {
  const register = useRegisterTruck(projectId);
  const { form, submit, lines } = useRecordForm(
    truckFormSchema,
    { label: '', hauler: '', bedVolumeCy: '', measuredBy: '', measuredOn: '' },
    TRUCK_LABELS,
    (body) => register.mutateAsync(body).then(saved(`Truck ${body.label} registered`)),
    onDone,
  );
  return (
    <form noValidate onSubmit={submit} aria-label="Register a truck" className="grid grid-cols-6 gap-3">
      <TextBox form={form} name="label" label={TRUCK_LABELS.label} className="col-span-2" placeholder="e.g. H-07" />
      <TextBox form={form} name="hauler" label={TRUCK_LABELS.hauler} className="col-span-4" />
      <TextBox form={form} name="bedVolumeCy" label="Bed volume (CY, 0.01)" numeric className="col-span-2" />
      <TextBox form={form} name="measuredBy" label={TRUCK_LABELS.measuredBy} className="col-span-2" />
      <TextBox form={form} name="measuredOn" label={TRUCK_LABELS.measuredOn} type="date" className="col-span-2" />
      <FormFooter lines={lines} saving={form.formState.isSubmitting} label="Register truck" onCancel={onDone} />
    </form>
  );
}

const ticket = createTruckTicketSchema.shape;
const ticketFormSchema = createTruckTicketSchema.extend({
  loadVolumeCy: optionalNumberText(ticket.loadVolumeCy.unwrap().unwrap(), 'Load volume'),
});
const TICKET_LABELS = {
  bidItemId: 'Bid item',
  deliveredOn: 'Delivered on',
  truckLabel: 'Truck',
  material: 'Material',
  source: 'Source',
  loadedAt: 'Loaded at',
  deliveredTo: 'Delivered to',
  loadCheckerInitials: 'Load checker',
  deliveryCheckerInitials: 'Delivery checker',
  loadVolumeCy: 'Load volume',
};

/** One load typed from its ticket; an unknown truck or a load above the bed is saved and flagged. */
export function TruckTicketForm({ projectId, onDone }: { projectId: string; onDone: () => void }) {
  const profiles = useProfiles(projectId);
  if (!profiles.data) return <LoadingState label="Loading the bid items…" />;
  const items = profiles.data.filter((p) => p.profile === 'truck_measure');
  if (items.length === 0) {
    return (
      <p className="text-sm text-stone-600">No bid item is paid by counted loads. Set an item's pay basis first.</p>
    );
  }
  return <TicketForm projectId={projectId} items={items} onDone={onDone} />;
}

function TicketForm({
  projectId,
  items,
  onDone,
}: {
  projectId: string;
  items: MeasurementProfileView[];
  onDone: () => void;
}) {
  const record = useRecordTruckTicket(projectId);
  const { form, submit, lines } = useRecordForm(
    ticketFormSchema,
    {
      bidItemId: items[0]!.bidItemId,
      deliveredOn: '',
      truckLabel: '',
      material: '',
      source: '',
      loadedAt: '',
      deliveredTo: '',
      loadCheckerInitials: '',
      deliveryCheckerInitials: '',
      loadVolumeCy: '',
    },
    TICKET_LABELS,
    (body) =>
      record
        .mutateAsync(body)
        .then((t) => saved(t.flags.length ? `Load saved and flagged: check truck ${t.truckLabel}` : 'Load saved')()),
    onDone,
  );
  return (
    <form noValidate onSubmit={submit} aria-label="Record a load ticket" className="grid grid-cols-6 gap-3">
      <SelectBox
        form={form}
        name="bidItemId"
        label={TICKET_LABELS.bidItemId}
        className="col-span-4"
        options={items.map((i) => ({ value: i.bidItemId, label: `${i.itemNumber} ${i.description}` }))}
      />
      <TextBox form={form} name="deliveredOn" label={TICKET_LABELS.deliveredOn} type="date" className="col-span-2" />
      <TextBox form={form} name="truckLabel" label={TICKET_LABELS.truckLabel} className="col-span-2" />
      <TextBox form={form} name="material" label={TICKET_LABELS.material} className="col-span-2" />
      <TextBox form={form} name="source" label={TICKET_LABELS.source} className="col-span-2" />
      <TextBox form={form} name="loadedAt" label={TICKET_LABELS.loadedAt} className="col-span-3" />
      <TextBox form={form} name="deliveredTo" label={TICKET_LABELS.deliveredTo} className="col-span-3" />
      <TextBox form={form} name="loadCheckerInitials" label="Load checker (initials)" className="col-span-2" />
      <TextBox form={form} name="deliveryCheckerInitials" label="Delivery checker (initials)" className="col-span-2" />
      <TextBox
        form={form}
        name="loadVolumeCy"
        label="Load volume (CY)"
        hint="Leave empty for the truck's bed"
        numeric
        className="col-span-2"
      />
      <FormFooter lines={lines} saving={form.formState.isSubmitting} label="Save load" onCancel={onDone} />
    </form>
  );
}
