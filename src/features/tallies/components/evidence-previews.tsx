import { FileText } from 'lucide-react';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { useEffect, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { LoadingState } from '@/components/ui/states';
import type { EvidenceView } from '@/shared/schemas/tally';

/**
 * A stored PDF read inside the page. The download route answers as an attachment (with nosniff), so the bytes are
 * fetched and shown from a blob of their checked content type in a frame (CSP frame-src allows only our own blobs).
 */
function PdfReader({ file, onClose }: { file: EvidenceView; onClose: () => void }) {
  const [url, setUrl] = useState<string | null>(null);
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    let made: string | null = null;
    let live = true;
    void fetch(file.downloadUrl, { credentials: 'same-origin' })
      .then(async (res) => {
        if (!res.ok) throw new Error(String(res.status));
        const blob = new Blob([await res.arrayBuffer()], { type: file.contentType });
        made = URL.createObjectURL(blob);
        if (live) setUrl(made);
      })
      .catch(() => live && setFailed(true));
    return () => {
      live = false;
      if (made) URL.revokeObjectURL(made);
    };
  }, [file]);
  return (
    <Dialog open onClose={onClose} title={file.fileName} className="w-[min(64rem,95vw)]">
      {failed ? (
        <p className="text-sm text-brick-700">The file could not be opened here; download it instead.</p>
      ) : url ? (
        <iframe title={`PDF ${file.fileName}`} src={url} className="h-[75vh] w-full rounded border border-stone-200" />
      ) : (
        <LoadingState label="Opening the file…" />
      )}
      <p className="mt-2 text-right text-sm">
        <a href={file.downloadUrl} className="text-spruce-800 underline-offset-2 hover:underline">
          Download {file.fileName}
        </a>
      </p>
    </Dialog>
  );
}

/** Photos shown as pictures and PDFs read in the page, beside the list of every file for download. */
export function EvidencePreviews({ evidence }: { evidence: EvidenceView[] }) {
  const [reading, setReading] = useState<EvidenceView | null>(null);
  const images = evidence.filter((e) => e.kind === 'image');
  const pdfs = evidence.filter((e) => e.kind === 'pdf');
  if (images.length === 0 && pdfs.length === 0) return null;
  return (
    <Card>
      <CardHeader>
        <CardTitle>Photos and documents</CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-3">
        {images.length ? (
          <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4">
            {images.map((e) => (
              <li key={e.id}>
                <figure className="overflow-hidden rounded-md border border-stone-200 bg-stone-50">
                  <img src={e.downloadUrl} alt={e.fileName} className="h-36 w-full object-contain" loading="lazy" />
                  <figcaption className="truncate px-2 py-1 text-xs text-stone-600">{e.fileName}</figcaption>
                </figure>
              </li>
            ))}
          </ul>
        ) : null}
        {pdfs.length ? (
          <ul className="flex flex-wrap gap-2">
            {pdfs.map((e) => (
              <li key={e.id}>
                <Button variant="secondary" size="sm" onClick={() => setReading(e)}>
                  <FileText aria-hidden /> Read {e.fileName}
                </Button>
              </li>
            ))}
          </ul>
        ) : null}
        {reading ? <PdfReader file={reading} onClose={() => setReading(null)} /> : null}
      </CardBody>
    </Card>
  );
}
