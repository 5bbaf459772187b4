import { Download, Upload } from 'lucide-react';
import { useRef } from 'react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { UploadError, UploadProgress } from '@/components/ui/upload-status';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { formatDate } from '@/lib/format';
import type { ChangeOrderDocumentView } from '@/shared/schemas/change-order';
import { useAttachChangeOrderDocuments, useChangeOrderDocuments } from '../api/change-order-documents';

const size = (bytes: number) =>
  bytes < 1024
    ? `${bytes} B`
    : bytes < 1024 ** 2
      ? `${(bytes / 1024).toFixed(1)} kB`
      : `${(bytes / 1024 ** 2).toFixed(1)} MB`;
const KIND_LABELS: Record<ChangeOrderDocumentView['kind'], string> = {
  csv: 'CSV',
  pdf: 'PDF',
  image: 'Image',
  landxml: 'LandXML',
};

/** The documents behind a change order: everyone on the project downloads; attaching only while it is proposed. */
export function DocumentsPanel({
  changeOrderId,
  canAttach,
  open,
}: {
  changeOrderId: string;
  canAttach: boolean;
  open: boolean;
}) {
  const input = useRef<HTMLInputElement>(null);
  const query = useChangeOrderDocuments(changeOrderId);
  const attach = useAttachChangeOrderDocuments(changeOrderId);
  const documents = query.data ?? [];
  return (
    <Card>
      <CardHeader>
        <CardTitle>Supporting documents ({documents.length})</CardTitle>
        {canAttach && open ? (
          <>
            <input
              ref={input}
              type="file"
              multiple
              accept=".csv,.pdf,.png,.jpg,.jpeg,.xml"
              className="sr-only"
              aria-label="Choose documents to attach"
              onChange={(e) => {
                const files = [...(e.target.files ?? [])];
                e.target.value = '';
                if (files.length)
                  attach.mutate(files, { onSuccess: (added) => toast.success(`Attached ${added.length} document(s)`) });
              }}
            />
            <Button variant="secondary" size="sm" disabled={attach.isPending} onClick={() => input.current?.click()}>
              <Upload aria-hidden />
              Attach documents
            </Button>
          </>
        ) : null}
      </CardHeader>
      <CardBody className="flex flex-col gap-2">
        {attach.isPending ? <UploadProgress progress={attach.progress} /> : null}
        {attach.isError ? <UploadError error={attach.error} /> : null}
        {query.isPending ? <LoadingState label="Loading the documents…" /> : null}
        {query.isError ? <ErrorState error={query.error} onRetry={() => void query.refetch()} /> : null}
        {query.isSuccess && documents.length === 0 ? (
          <p className="text-sm text-stone-600">
            No documents attached.{' '}
            {canAttach && open
              ? 'Attach field notes, survey files, photos or quotes that support the change (CSV, PDF, PNG, JPEG, LandXML).'
              : ''}
          </p>
        ) : null}
        {documents.length > 0 ? (
          <ul className="divide-y divide-stone-100">
            {documents.map((d) => (
              <li key={d.id} className="flex items-center justify-between gap-3 py-1.5 text-sm">
                <span className="min-w-0">
                  <span className="font-medium break-all">{d.fileName}</span>
                  <span className="ml-2 text-xs text-stone-500">
                    {KIND_LABELS[d.kind]} · {size(d.sizeBytes)} · {d.uploadedBy}, {formatDate(d.createdAt)}
                  </span>
                </span>
                <a
                  href={d.downloadUrl}
                  download
                  aria-label={`Download ${d.fileName}`}
                  className="inline-flex shrink-0 items-center gap-1 rounded px-2 py-1 text-xs font-medium text-spruce-800 hover:bg-spruce-50 focus-visible:outline-2 focus-visible:outline-spruce-600"
                >
                  <Download aria-hidden className="size-3.5" />
                  Download
                </a>
              </li>
            ))}
          </ul>
        ) : null}
        {!open && documents.length > 0 ? (
          <p className="text-xs text-stone-500">The change order is decided; its documents stay as they were.</p>
        ) : null}
      </CardBody>
    </Card>
  );
}
