import { Download, Trash2, Upload } from 'lucide-react';
import { useRef } from 'react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { UploadError, UploadProgress } from '@/components/ui/upload-status';
import { errorMessage } from '@/lib/api-client';
import { formatCount, formatDate } from '@/lib/format';
import type { EvidenceView } from '@/shared/schemas/tally';
import { useDeleteEvidence } from '../api/save-tally';
import { useUploadEvidence } from '../api/upload-evidence';

const size = (bytes: number) =>
  bytes < 1024
    ? `${bytes} B`
    : bytes < 1024 ** 2
      ? `${(bytes / 1024).toFixed(1)} kB`
      : `${(bytes / 1024 ** 2).toFixed(1)} MB`;
const KIND_LABELS: Record<EvidenceView['kind'], string> = {
  csv: 'CSV',
  pdf: 'PDF',
  image: 'Image',
  landxml: 'LandXML',
};

/** The files behind a tally: download for everyone on the project; upload (with progress) and remove for its writers. */
export function EvidencePanel({
  tallyId,
  evidence,
  canUpload,
  canRemove,
}: {
  tallyId: string;
  evidence: EvidenceView[];
  canUpload: boolean;
  canRemove: boolean;
}) {
  const input = useRef<HTMLInputElement>(null);
  const upload = useUploadEvidence(tallyId);
  const remove = useDeleteEvidence();
  return (
    <Card>
      <CardHeader>
        <CardTitle>Evidence ({evidence.length})</CardTitle>
        {canUpload ? (
          <>
            <input
              ref={input}
              type="file"
              multiple
              accept=".csv,.pdf,.png,.jpg,.jpeg,.xml"
              className="sr-only"
              aria-label="Choose evidence files"
              onChange={(e) => {
                const files = [...(e.target.files ?? [])];
                e.target.value = '';
                if (files.length)
                  upload.mutate(files, {
                    onSuccess: (added) => toast.success(`Added ${formatCount(added.length, 'file')}`),
                  });
              }}
            />
            <Button variant="secondary" size="sm" disabled={upload.isPending} onClick={() => input.current?.click()}>
              <Upload aria-hidden />
              Add files
            </Button>
          </>
        ) : null}
      </CardHeader>
      <CardBody className="flex flex-col gap-2">
        {upload.isPending ? <UploadProgress progress={upload.progress} /> : null}
        {upload.isError ? <UploadError error={upload.error} /> : null}
        {evidence.length === 0 ? (
          <p className="text-sm text-stone-600">
            No files yet.{' '}
            {canUpload ? 'Add survey files, tickets, photos or LandXML surfaces (CSV, PDF, PNG, JPEG, .xml).' : ''}
          </p>
        ) : (
          <ul className="divide-y divide-stone-100">
            {evidence.map((e) => (
              <li key={e.id} className="flex items-center justify-between gap-3 py-1.5 text-sm">
                <span className="min-w-0">
                  <span className="font-medium break-all">{e.fileName}</span>
                  <span className="ml-2 text-xs text-stone-500">
                    {KIND_LABELS[e.kind]} · {size(e.sizeBytes)} · {e.uploadedBy}, {formatDate(e.createdAt)}
                  </span>
                </span>
                <span className="flex shrink-0 gap-1">
                  <a
                    href={e.downloadUrl}
                    download
                    aria-label={`Download ${e.fileName}`}
                    className="inline-flex items-center gap-1 rounded px-2 py-1 text-xs font-medium text-spruce-800 hover:bg-spruce-50 focus-visible:outline-2 focus-visible:outline-spruce-600"
                  >
                    <Download aria-hidden className="size-3.5" />
                    Download
                  </a>
                  {canRemove ? (
                    <Button
                      variant="ghost"
                      size="sm"
                      aria-label={`Remove ${e.fileName}`}
                      disabled={remove.isPending}
                      onClick={() => remove.mutate(e.id, { onError: (err) => toast.error(errorMessage(err)) })}
                    >
                      <Trash2 aria-hidden />
                    </Button>
                  ) : null}
                </span>
              </li>
            ))}
          </ul>
        )}
      </CardBody>
    </Card>
  );
}
