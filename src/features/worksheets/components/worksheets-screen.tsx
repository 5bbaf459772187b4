import { Save } from 'lucide-react';
import { Suspense, useCallback, useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { cn } from '@/lib/cn';
import { formatQuantity } from '@/lib/format';
import { MEASUREMENT_METHOD_LABELS, type UnitSystem } from '@/shared/constants';
import type { BidItemView } from '@/shared/schemas/bid-item';
import type { TallyView } from '@/shared/schemas/tally';
import { useCreateTally } from '../api/create-tally';
import { useTally } from '../api/get-tally';
import { SAVEABLE_METHODS, WORKSHEET_METHODS, type WorksheetMethod } from '../lib/types';
import { lengthUnitOf } from '../lib/units';
import { SaveTallyForm } from './save-tally-form';
import { WORKSHEET_BLURBS, WORKSHEET_SCREENS } from './worksheet-screens';

type WorksheetsScreenProps = {
  projectId: string;
  units: UnitSystem;
  /** Only the subcontractor saves tallies; everyone else uses the worksheets as calculators. */
  canSave: boolean;
  bidItems: readonly BidItemView[];
  defaults: { swellPercent: number; shrinkagePercent: number };
};

function isMethod(value: string | null): value is WorksheetMethod {
  return (WORKSHEET_METHODS as readonly string[]).includes(value ?? '');
}

export function WorksheetsScreen({ projectId, units, canSave, bidItems, defaults }: WorksheetsScreenProps) {
  const [params] = useSearchParams();
  const tallyId = params.get('tally');
  const tally = useTally(tallyId);
  const asked = params.get('method');
  const method: WorksheetMethod = tally.data && isMethod(tally.data.tally.method) ? tally.data.tally.method : isMethod(asked) ? asked : 'end-area';
  // Tagged with their method: while the next worksheet's chunk loads, the last one's inputs must not be saved.
  const [reported, setReported] = useState<{ method: WorksheetMethod; inputs: Record<string, unknown> | null } | null>(null);
  const [saving, setSaving] = useState(false);
  const [saved, setSaved] = useState<TallyView | null>(null);
  const create = useCreateTally(projectId);
  const onInputs = useCallback((next: Record<string, unknown> | null) => setReported({ method, inputs: next }), [method]);
  const inputs = reported?.method === method ? reported.inputs : null;
  const Screen = WORKSHEET_SCREENS[method];
  const saveable = SAVEABLE_METHODS.has(method);
  const initial = tally.data && tally.data.tally.method === method ? tally.data.tally.inputs : null;

  return (
    <div className="space-y-4">
      <nav aria-label="Worksheets" className="flex flex-wrap gap-1.5">
        {WORKSHEET_METHODS.map((m) => (
          <Link
            key={m}
            to={`?method=${m}`}
            aria-current={m === method ? 'page' : undefined}
            onClick={() => setSaved(null)}
            className={cn(
              'rounded-full border px-3 py-1 text-sm',
              m === method ? 'border-spruce-700 bg-spruce-700 text-white' : 'border-stone-300 bg-white text-stone-700 hover:bg-stone-100',
            )}
          >
            {MEASUREMENT_METHOD_LABELS[m]}
          </Link>
        ))}
      </nav>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 className="text-lg font-semibold text-stone-900">{MEASUREMENT_METHOD_LABELS[method]}</h2>
          <p className="text-sm text-stone-600">{WORKSHEET_BLURBS[method]}</p>
          {tally.data ? <p className="text-xs text-stone-500">Started from the tally “{tally.data.tally.title || tally.data.tally.measuredOn}”.</p> : null}
        </div>
        {canSave && saveable ? (
          <Button onClick={() => setSaving(true)} disabled={!inputs} title={inputs ? undefined : 'Fix the inputs first'}>
            <Save aria-hidden /> Save as tally
          </Button>
        ) : canSave ? (
          <p className="max-w-xs text-xs text-stone-500">This worksheet is a planner; its figures are not billed as a tally.</p>
        ) : (
          <p className="max-w-xs text-xs text-stone-500">Calculator only: the subcontractor saves worksheets as tallies.</p>
        )}
      </div>
      {saved ? (
        <Alert tone="success">
          Saved as a draft tally for {saved.bidItem.itemNumber} · {saved.bidItem.description}: {formatQuantity(saved.quantity, saved.bidItem.payUnit)} (worked by the server).
        </Alert>
      ) : null}
      {tally.isError ? <ErrorState title="The tally could not be opened" error={tally.error} /> : null}
      {tallyId && tally.isPending ? (
        <LoadingState label="Opening the tally…" />
      ) : (
        <Suspense fallback={<LoadingState label="Opening the worksheet…" />}>
          <Screen key={`${method}:${tallyId ?? ''}`} unit={lengthUnitOf(units)} initial={initial} defaults={defaults} onInputs={onInputs} />
        </Suspense>
      )}
      <Dialog open={saving && inputs !== null} onClose={() => setSaving(false)} title="Save as tally" description="A draft tally for a bid item, backed by this worksheet.">
        {inputs ? (
          <SaveTallyForm
            method={method}
            inputs={inputs}
            bidItems={bidItems}
            onCancel={() => setSaving(false)}
            onSave={async (body) => {
              const tally = await create.mutateAsync(body);
              setSaved(tally);
              setSaving(false);
              return tally;
            }}
          />
        ) : null}
      </Dialog>
    </div>
  );
}
