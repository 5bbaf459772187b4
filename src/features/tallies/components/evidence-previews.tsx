import { FileText } from 'lucide-react';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import type { EvidenceView } from '@/shared/schemas/tally';

/**
 * Opens a stored file for viewing in a new tab. The download route answers as an attachment (with nosniff), so the
 * bytes are fetched and shown from a blob of their checked content type; nothing is framed in the app's page.
 */
async function view(file: EvidenceView) {
  const tab = window.open('', '_blank');
  const res = await fetch(file.downloadUrl, { credentials: 'same-origin' });
  const blob = new Blob([await res.arrayBuffer()], { type: file.contentType });
  const url = URL.createObjectURL(blob);
  if (tab) tab.location.href = url;
  else window.location.assign(url);
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

/** Photos shown as pictures and PDFs opened for reading, beside the list of every file for download. */
export function EvidencePreviews({ evidence }: { evidence: EvidenceView[] }) {
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
                <Button variant="secondary" size="sm" onClick={() => void view(e)}>
                  <FileText aria-hidden /> Read {e.fileName}
                </Button>
              </li>
            ))}
          </ul>
        ) : null}
      </CardBody>
    </Card>
  );
}
