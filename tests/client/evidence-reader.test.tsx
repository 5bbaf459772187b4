// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { EvidencePreviews } from '@/features/tallies/components/evidence-previews';
import type { EvidenceView } from '@/shared/schemas/tally';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

// Issue 12 item 5: a PDF of a tally's evidence is read inside the page (a frame of a blob of its checked bytes),
// and stays downloadable as an attachment.
const PDF: EvidenceView = {
  id: 'e1',
  tallyId: 't1',
  fileName: 'haul-tickets-nov-3.pdf',
  contentType: 'application/pdf',
  kind: 'pdf',
  sizeBytes: 9,
  sha256: '0'.repeat(64),
  uploadedBy: 'R. Dunmore',
  createdAt: '2026-11-03T15:00:00Z',
  downloadUrl: '/api/evidence/e1/download',
};

describe('reading a PDF of the evidence', () => {
  it('opens it in the page from a blob of its bytes, with the download beside it', async () => {
    const fetchMock = vi.fn(async () => new Response('%PDF-1.7\n', { status: 200 }));
    vi.stubGlobal('fetch', fetchMock);
    const made = vi.fn(() => 'blob:http://localhost/pdf-1');
    const revoked = vi.fn();
    vi.stubGlobal('URL', Object.assign(URL, { createObjectURL: made, revokeObjectURL: revoked }));
    const user = userEvent.setup();
    render(<EvidencePreviews evidence={[PDF]} />);
    await user.click(screen.getByRole('button', { name: /Read haul-tickets-nov-3\.pdf/ }));
    const frame = await screen.findByTitle('PDF haul-tickets-nov-3.pdf');
    expect(frame.getAttribute('src')).toBe('blob:http://localhost/pdf-1');
    expect(fetchMock).toHaveBeenCalledWith('/api/evidence/e1/download', { credentials: 'same-origin' });
    expect(screen.getByRole('link', { name: 'Download haul-tickets-nov-3.pdf' }).getAttribute('href')).toBe(
      '/api/evidence/e1/download',
    );
    cleanup();
    expect(revoked).toHaveBeenCalledWith('blob:http://localhost/pdf-1');
  });
});
