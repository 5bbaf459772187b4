import { useRef, useState } from 'react';
import { toast } from 'sonner';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { errorMessage, isApiError } from '@/lib/api-client';
import { useRecordBaseline } from '../api/surface-baselines';

/**
 * Records an original ground surface: a LandXML file or a point file (PNEZD or PENZD), the area it covers, the
 * unit of a file without units, and a point file's column order when its header does not say it (the server asks).
 */
export function RecordBaselineForm({ projectId }: { projectId: string }) {
  const record = useRecordBaseline(projectId);
  const fileInput = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [area, setArea] = useState('');
  const [unit, setUnit] = useState<'ft' | 'm' | ''>('');
  const [order, setOrder] = useState<'PNEZD' | 'PENZD' | ''>('');
  const error = record.error;
  const details = isApiError(error) ? (error.details ?? []) : [];
  return (
    <Card>
      <CardHeader>
        <CardTitle>Record original ground</CardTitle>
      </CardHeader>
      <CardBody>
        <form
          className="flex flex-wrap items-start gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            if (!file) return;
            record.mutate(
              { file, area, unit, order },
              {
                onSuccess: () => {
                  toast.success('Original ground recorded: it now needs both sides’ acceptance.');
                  setFile(null);
                  if (fileInput.current) fileInput.current.value = '';
                },
              },
            );
          }}
        >
          <Field
            label="Surface file"
            hint="LandXML (its first surface with points, with its faces) or a point file (.csv: point, northing, easting, elevation, description). Its SHA-256 is kept."
          >
            {(c) => (
              <Input
                {...c}
                ref={fileInput}
                type="file"
                accept=".xml,.landxml,.csv,.txt"
                onChange={(e) => setFile(e.target.files?.[0] ?? null)}
              />
            )}
          </Field>
          <Field label="Area" hint="Leave empty for the whole project." className="w-48">
            {(c) => <Input {...c} value={area} maxLength={80} onChange={(e) => setArea(e.target.value)} />}
          </Field>
          <Field label="Units if the file has none" hint="A point file never has units." className="w-48">
            {(c) => (
              <Select {...c} value={unit} onChange={(e) => setUnit(e.target.value as 'ft' | 'm' | '')}>
                <option value="">Read from the file</option>
                <option value="ft">Feet</option>
                <option value="m">Metres</option>
              </Select>
            )}
          </Field>
          <Field label="Point file column order" hint="Only when its header does not name them." className="w-56">
            {(c) => (
              <Select {...c} value={order} onChange={(e) => setOrder(e.target.value as 'PNEZD' | 'PENZD' | '')}>
                <option value="">From its header</option>
                <option value="PNEZD">PNEZD: northing before easting</option>
                <option value="PENZD">PENZD: easting before northing</option>
              </Select>
            )}
          </Field>
          <Button type="submit" className="mt-5" disabled={!file || record.isPending}>
            {record.isPending ? 'Reading…' : 'Record'}
          </Button>
        </form>
        {error ? (
          <Alert tone="error" className="mt-3">
            {errorMessage(error)}
            {details.length > 1 ? (
              <ul className="mt-1 list-disc pl-5">
                {details.slice(0, 10).map((d, i) => (
                  <li key={i}>{d.message}</li>
                ))}
              </ul>
            ) : null}
          </Alert>
        ) : null}
      </CardBody>
    </Card>
  );
}
