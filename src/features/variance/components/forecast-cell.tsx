import { Pencil } from 'lucide-react';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/input';
import { errorMessage } from '@/lib/api-client';
import { formatQuantity } from '@/lib/format';
import { forecastInputSchema, type VarianceRowView } from '@/shared/schemas/variance';
import { useSetForecast } from '../api/variance';

/** The forecast at completion, editable in place by the contractors (Enter saves, Escape cancels). */
export function ForecastCell({ row, canEdit }: { row: VarianceRowView; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState('');
  const [error, setError] = useState<string | null>(null);
  const save = useSetForecast(row.bidItemId);
  const shown = (
    <span title={row.forecast ? `${row.forecast.updatedBy}: ${row.forecast.note || 'no note'}` : 'No forecast: approved + pending'}>
      {formatQuantity(row.forecastAtCompletion, row.payUnit)}
      {row.forecast ? null : <span className="ml-1 text-xs text-stone-500">(to date)</span>}
    </span>
  );
  if (!editing) {
    return (
      <span className="inline-flex items-center justify-end gap-1">
        {shown}
        {canEdit ? (
          <Button variant="ghost" size="icon-sm" aria-label={`Edit the forecast of item ${row.itemNumber}`} onClick={() => { setText(String(row.forecastAtCompletion)); setEditing(true); }}>
            <Pencil />
          </Button>
        ) : null}
      </span>
    );
  }
  const submit = () => {
    const parsed = forecastInputSchema.safeParse({ forecastQuantity: Number(text.replace(/,/g, '')), note: '' });
    if (!parsed.success || text.trim() === '') {
      setError(parsed.success ? 'Type a quantity' : (parsed.error.issues[0]?.message ?? 'Type a quantity'));
      return;
    }
    save.mutate(parsed.data, {
      onSuccess: () => { setEditing(false); setError(null); toast.success(`Forecast of item ${row.itemNumber} saved`); },
      onError: (e) => setError(errorMessage(e)),
    });
  };
  return (
    <span className="inline-flex flex-col items-end gap-0.5">
      <span className="inline-flex items-center gap-1">
        <Input
          autoFocus
          aria-label={`Forecast at completion of item ${row.itemNumber} (${row.payUnit})`}
          aria-invalid={Boolean(error)}
          inputMode="decimal"
          className="num h-7 w-28"
          value={text}
          onChange={(e) => setText(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === 'Enter') submit();
            if (e.key === 'Escape') setEditing(false);
          }}
        />
        <span className="text-xs text-stone-500">{row.payUnit}</span>
        <Button size="sm" onClick={submit} disabled={save.isPending}>Save</Button>
      </span>
      {error ? <span role="alert" className="text-brick-700 text-xs">{error}</span> : null}
    </span>
  );
}
