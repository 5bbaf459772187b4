import { Save } from 'lucide-react';
import { Suspense, useCallback, useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import { toast } from 'sonner';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { cn } from '@/lib/cn';
import { formatCount, formatQuantity } from '@/lib/format';
import { MEASUREMENT_METHOD_LABELS, METHOD_BILLING, type TallyStatus, type UnitSystem } from '@/shared/constants';
import type { BidItemView } from '@/shared/schemas/bid-item';
import type { EvidenceView, TallyView } from '@/shared/schemas/tally';
import { useTally } from '../api/get-tally';
import { useSaveWorksheetTally } from '../api/save-tally';
import { previewBill } from '../lib/bill-preview';
import { splitTallyInputs } from '../lib/tally-inputs';
import { WORKSHEET_METHODS, type WorksheetMethod } from '../lib/types';
import { lengthUnitOf } from '../lib/units';
import { WorksheetFilesContext } from '../lib/worksheet-files';
import { BillingBar, type BillChoice } from './billing-bar';
import { SaveTallyForm } from './save-tally-form';
import { WORKSHEET_BLURBS, WORKSHEET_SCREENS } from './worksheet-screens';

/** Why a tally opened here is read-only, by its status (the reader's permissions come from `tally.can`). */
const TALLY_STATE_PHRASES: Record<TallyStatus, string> = {
  draft: 'a draft someone else keeps',
  ready: 'marked ready to bill',
  billed: 'on a pay application',
};

type WorksheetsScreenProps = {
  projectId: string;
  units: UnitSystem;
  /** Only the subcontractor saves tallies; everyone else uses the worksheets as calculators. */
  canSave: boolean;
  bidItems: readonly BidItemView[];
  defaults: { swellPercent: number; shrinkagePercent: number };
};

function isMethod(value: string | null | undefined): value is WorksheetMethod {
  return (WORKSHEET_METHODS as readonly string[]).includes(value ?? '');
}

type Reported = {
  method: WorksheetMethod;
  inputs: Record<string, unknown> | null;
  result: Record<string, unknown> | null;
};

/** Thousands separators allowed: "1,850" and "1850" are the same density. */
const parseDensity = (text: string) => (text.trim() ? Number(text.replaceAll(',', '')) : null);

export function WorksheetsScreen(props: WorksheetsScreenProps) {
  const [params] = useSearchParams();
  const tallyId = params.get('tally');
  const tally = useTally(tallyId);
  if (tallyId && tally.isPending) return <LoadingState label="Opening the tally…" />;
  if (tally.isError) return <ErrorState title="The tally could not be opened" error={tally.error} />;
  // Keyed by the tally: opening another one starts its worksheet afresh.
  return (
    <Worksheets
      key={tallyId ?? ''}
      {...props}
      tally={tally.data?.tally ?? null}
      evidence={tally.data?.evidence ?? []}
    />
  );
}

function Worksheets({
  projectId,
  units,
  canSave,
  bidItems,
  defaults,
  tally,
  evidence,
}: WorksheetsScreenProps & { tally: TallyView | null; evidence: readonly EvidenceView[] }) {
  const [params] = useSearchParams();
  const asked = params.get('method');
  const method: WorksheetMethod = tally && isMethod(tally.method) ? tally.method : isMethod(asked) ? asked : 'end-area';
  const saved = useMemo(() => splitTallyInputs(tally?.inputs ?? null), [tally]);
  const editable = tally === null || tally.can.edit;
  const matching = bidItems.filter((b) => b.method === method);
  const [choice, setChoice] = useState<BillChoice>(() => ({
    bidItemId: tally?.bidItem.id ?? params.get('item') ?? (matching.length === 1 ? matching[0]!.id : ''),
    component: saved.component ?? '',
    density: saved.density ? String(saved.density) : '',
  }));
  // Tagged with their method: while the next worksheet's chunk loads, the last one's inputs must not be saved.
  const [reported, setReported] = useState<Reported | null>(null);
  const [files, setFiles] = useState<ReadonlyMap<string, File>>(new Map());
  const [saving, setSaving] = useState(false);
  const [done, setDone] = useState<TallyView | null>(null);
  const save = useSaveWorksheetTally(projectId);
  const onInputs = useCallback(
    (inputs: Record<string, unknown> | null, result: Record<string, unknown> | null) =>
      setReported({ method, inputs, result }),
    [method],
  );
  const current = reported?.method === method ? reported : null;
  const item = bidItems.find((b) => b.id === choice.bidItemId);
  const options = {
    component: choice.component || undefined,
    density: parseDensity(choice.density),
    measuredBasis: saved.measuredBasis,
  };
  const factors = { ...defaults, units };
  const preview =
    item && current?.inputs ? previewBill(method, current.inputs, current.result, item, factors, options) : null;
  const billing = METHOD_BILLING[method];
  const filesValue = useMemo(
    () => ({
      attached: files,
      attach: (slot: string, file: File) => setFiles((m) => new Map(m).set(slot, file)),
      detach: (slot: string) => setFiles((m) => (m.has(slot) ? new Map([...m].filter(([k]) => k !== slot)) : m)),
      readOnly: !editable || !canSave,
    }),
    [files, editable, canSave],
  );
  const Screen = WORKSHEET_SCREENS[method];
  const tallyUrl = (id: string) => `/projects/${projectId}/tallies/${id}`;

  const onSave = async ({ sanityReason, ...values }: { measuredOn: string; title: string; sanityReason: string }) => {
    if (!item || !current?.inputs) return;
    const body = {
      bidItemId: item.id,
      ...values,
      method,
      inputs: current.inputs,
      ...(options.component ? { component: options.component } : {}),
      ...(options.measuredBasis ? { measuredBasis: options.measuredBasis } : {}),
      ...(options.density ? { density: options.density } : {}),
      ...(sanityReason ? { sanityReason } : {}),
    };
    const { tally: result, evidence } = await save.mutateAsync({
      tallyId: tally?.can.edit ? tally.id : null,
      body,
      files: [...files.values()],
    });
    setDone(result);
    setSaving(false);
    setFiles(new Map());
    toast.success(
      `Saved: ${formatQuantity(result.quantity, result.bidItem.payUnit, result.result?.basis)} to item ${result.bidItem.itemNumber}${evidence.length ? `, with ${formatCount(evidence.length, 'file')} as evidence` : ''}`,
    );
  };

  return (
    <WorksheetFilesContext.Provider value={filesValue}>
      <div className="space-y-4">
        {tally ? null : (
          <nav aria-label="Worksheets" className="flex flex-wrap gap-1.5">
            {WORKSHEET_METHODS.map((m) => (
              <Link
                key={m}
                to={`?method=${m}${choice.bidItemId && bidItems.find((b) => b.id === choice.bidItemId)?.method === m ? `&item=${choice.bidItemId}` : ''}`}
                aria-current={m === method ? 'page' : undefined}
                onClick={() => setDone(null)}
                className={cn(
                  'rounded-full border px-3 py-1 text-sm',
                  m === method
                    ? 'border-spruce-700 bg-spruce-700 text-white'
                    : 'border-stone-300 bg-white text-stone-700 hover:bg-stone-100',
                )}
              >
                {MEASUREMENT_METHOD_LABELS[m]}
              </Link>
            ))}
          </nav>
        )}
        <div className="flex flex-wrap items-start justify-between gap-3">
          <div>
            <h2 className="text-lg font-semibold text-stone-900">{MEASUREMENT_METHOD_LABELS[method]}</h2>
            <p className="text-sm text-stone-600">{WORKSHEET_BLURBS[method]}</p>
            {tally ? (
              <p className="text-xs text-stone-600">
                {editable ? 'Editing the draft tally' : 'Read-only: the tally'}{' '}
                <Link className="text-spruce-700 underline" to={tallyUrl(tally.id)}>
                  “{tally.title || tally.measuredOn}”
                </Link>
                {editable
                  ? '; saving keeps the earlier inputs as a revision.'
                  : ` is ${TALLY_STATE_PHRASES[tally.status]}; changes here are not saved.`}
              </p>
            ) : null}
            {tally ? <TallyFiles evidence={evidence} /> : null}
          </div>
          {canSave && billing.bills && editable ? (
            <Button
              onClick={() => setSaving(true)}
              disabled={!preview?.bill}
              title={preview?.bill ? undefined : 'Choose the bid item and fix the inputs first'}
            >
              <Save aria-hidden /> {tally ? 'Save changes' : 'Save as tally'}
            </Button>
          ) : !canSave && !tally ? (
            <p className="max-w-xs text-xs text-stone-500">
              Calculator only: the subcontractor saves worksheets as tallies.
            </p>
          ) : null}
        </div>
        {canSave || tally ? (
          <BillingBar
            method={method}
            bidItems={bidItems}
            choice={choice}
            onChoice={setChoice}
            preview={preview}
            disabled={!editable || !canSave}
          />
        ) : null}
        {done ? (
          <Alert tone="success">
            Saved as a draft tally: {formatQuantity(done.quantity, done.bidItem.payUnit, done.result?.basis)} to item{' '}
            {done.bidItem.itemNumber} · {done.bidItem.description}.{' '}
            <Link className="font-medium underline" to={tallyUrl(done.id)}>
              Open the tally
            </Link>
          </Alert>
        ) : null}
        <Suspense fallback={<LoadingState label="Opening the worksheet…" />}>
          <fieldset disabled={!editable} className="min-w-0">
            <Screen
              key={method}
              unit={lengthUnitOf(units)}
              initial={saved.inputs}
              defaults={defaults}
              onInputs={onInputs}
            />
          </fieldset>
        </Suspense>
        <Dialog
          open={saving && Boolean(preview?.bill) && Boolean(item)}
          onClose={() => setSaving(false)}
          title={tally ? 'Save changes to the tally' : 'Save as tally'}
          description="A draft tally for the bid item, backed by this worksheet."
        >
          {item && preview?.bill ? (
            <SaveTallyForm
              item={item}
              preview={preview}
              files={[...files.values()]}
              start={tally ? { measuredOn: tally.measuredOn, title: tally.title } : {}}
              updating={tally !== null}
              onCancel={() => setSaving(false)}
              onSave={onSave}
            />
          ) : null}
        </Dialog>
      </div>
    </WorksheetFilesContext.Provider>
  );
}

/** The files saved with the tally (its evidence), each downloadable; the boxes below hold what was read from them. */
function TallyFiles({ evidence }: { evidence: readonly EvidenceView[] }) {
  if (evidence.length === 0)
    return <p className="text-xs text-stone-600">No evidence file is saved with this tally.</p>;
  return (
    <p className="text-xs text-stone-600">
      Evidence saved with the tally:{' '}
      {evidence.map((e, i) => (
        <span key={e.id}>
          {i > 0 ? ', ' : ''}
          <a className="text-spruce-700 underline" href={e.downloadUrl} download aria-label={`Download ${e.fileName}`}>
            {e.fileName}
          </a>
        </span>
      ))}
    </p>
  );
}
