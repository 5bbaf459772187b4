import { Download, Upload } from 'lucide-react';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { UploadProgress } from '@/components/ui/upload-status';
import { ApiError, errorMessage } from '@/lib/api-client';
import { MAX_CSV_UPLOAD_BYTES } from '@/shared/constants';
import { BID_ITEM_CSV_COLUMNS } from '@/shared/schemas/bid-item';
import { useImportBidItems } from '../api/import-bid-items';
import { downloadBidScheduleTemplate } from './csv-template';
import { ImportErrorsTable } from './import-errors-table';

type ImportPanelProps = { projectId: string; open: boolean; onClose: () => void };

/** CSV import: pick a file, upload it with progress, and see either the count or every bad row. */
export function ImportPanel({ projectId, open, onClose }: ImportPanelProps) {
  const upload = useImportBidItems(projectId);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const details = upload.error instanceof ApiError ? upload.error.details : [];

  function pick(next: File | null) {
    upload.reset();
    setFile(next);
    setFileError(
      next && next.size > MAX_CSV_UPLOAD_BYTES
        ? `The file is larger than ${MAX_CSV_UPLOAD_BYTES / 1024 / 1024} MB.`
        : undefined,
    );
  }

  function close() {
    upload.reset();
    setFile(null);
    setFileError(undefined);
    onClose();
  }

  return (
    <Dialog open={open} onClose={close} title="Import bid items from CSV" className="w-[min(44rem,calc(100vw-2rem))]">
      <div className="flex flex-col gap-4">
        <p className="text-stone-700">
          One bid item per row, with a first row naming the columns{' '}
          <code className="rounded bg-stone-100 px-1 font-mono text-xs">{BID_ITEM_CSV_COLUMNS.join(', ')}</code>. Unit
          price in dollars; major is yes or no. The file is saved whole or not at all.
        </p>
        <div>
          <Button variant="secondary" size="sm" onClick={downloadBidScheduleTemplate}>
            <Download aria-hidden />
            Download the template
          </Button>
        </div>
        <form
          className="flex flex-wrap items-end gap-3"
          onSubmit={(event) => {
            event.preventDefault();
            if (file && !fileError) upload.mutate(file);
          }}
        >
          <Field label="CSV file" error={fileError} className="min-w-64 flex-1">
            {(control) => (
              <Input
                type="file"
                accept=".csv,text/csv"
                className="py-1 file:mr-3 file:rounded file:border-0 file:bg-stone-100 file:px-2 file:py-1 file:text-stone-800"
                onChange={(event) => pick(event.target.files?.[0] ?? null)}
                {...control}
              />
            )}
          </Field>
          <Button type="submit" disabled={!file || Boolean(fileError) || upload.isPending}>
            <Upload aria-hidden />
            {upload.isPending ? 'Uploading…' : 'Upload and import'}
          </Button>
        </form>
        {upload.isPending ? <UploadProgress progress={upload.progress} checking="Checking rows…" /> : null}
        {upload.isSuccess ? (
          <Alert tone="success">
            Imported {upload.data.imported} {upload.data.imported === 1 ? 'bid item' : 'bid items'}.
          </Alert>
        ) : null}
        {upload.isError ? (
          <div className="flex flex-col gap-2">
            <Alert>
              {details.length
                ? `Nothing was imported. Fix ${details.length === 1 ? 'this problem' : `these ${details.length} problems`} in the file and upload it again.`
                : `Nothing was imported. ${errorMessage(upload.error)}`}
            </Alert>
            {details.length ? <ImportErrorsTable details={details} /> : null}
          </div>
        ) : null}
      </div>
    </Dialog>
  );
}
