import type { PublishedRecordView } from '@cribra/contracts';
import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderRoutes } from '../../../test-utils/render';
import RecordPage from './record-page';

const ID = '0123456789abcdef0123';
const user = (n: string) => ({ id: n, displayName: n });

function record(withdrawn: boolean): PublishedRecordView {
  return {
    id: ID,
    notebookId: 'nb',
    url: `http://127.0.0.1/records/${ID}`,
    recordSha256: 'ab'.repeat(32),
    publishedAt: '2026-12-04T12:00:00.000Z',
    publishedBy: user('Teodor Quill'),
    withdrawal: withdrawn ? { at: '2026-12-05T12:00:00.000Z', by: user('Teodor Quill'), reason: 'Superseded by a larger census.' } : null,
    title: 'Gap patterns',
    summary: 'Exact counts.',
    authors: [user('Teodor Quill'), user('Ilse Marenko')],
    reviewers: [user('Noor Abeyratne')],
    cells: [{ id: 'c1', position: 0, kind: 'claim', title: 'Balance', source: 'claim balance: gapcount(2, p) = gapcount(4, p)\n  over p ∈ primes 3..23', outputDigest: 'cd'.repeat(32), outputs: [] }],
    uploads: [{ name: 'decuplet', kind: 'tuples', mediaType: 'text/plain', sizeBytes: 42, sha256: 'ef'.repeat(32) }],
    citation: { bibtex: `@misc{cribra-${ID},\n}`, text: 'Teodor Quill and Ilse Marenko. Gap patterns.' },
    verifyCommand: `cribra verify http://127.0.0.1/api/records/${ID}/export?format=json`,
    record: {
      notebookId: 'nb', title: 'Gap patterns', notebookRevision: 3, revisionDigest: '12'.repeat(32), digestVersion: 'v1',
      lockedBy: user('Teodor Quill'), lockedAt: '2026-12-04T11:00:00.000Z',
      signers: [{ reviewId: 'r', user: user('Noor Abeyratne'), signedAt: '2026-12-04T10:00:00.000Z', verificationId: null, comment: 'All digests match.' }],
      requiredSignoffs: 1, engineVersion: '0.1.0', languageVersion: '0.1.0', runEngineVersions: [], runLanguageVersions: [],
      cells: [{ id: 'c1', position: 0, kind: 'claim', sourceSha256: '34'.repeat(32), source: '', outputDigest: null, runId: null, engineVersion: null, languageVersion: null }],
      // A field this page has no section for is still shown.
      recordFormat: 'cribra-record-v2',
    } as unknown as PublishedRecordView['record'],
  };
}

const routes = [{ path: '/records/:id', element: <RecordPage /> }];

describe('RecordPage', () => {
  it('shows the record, its reviewers, uploads with hashes, downloads, citation and verify command', async () => {
    mockFetch({ [`GET /api/records/${ID}`]: { body: record(false) } });
    renderRoutes(routes, `/records/${ID}`);
    expect(await screen.findByRole('heading', { name: 'Gap patterns', level: 1 })).toBeTruthy();
    expect(screen.queryByTestId('withdrawn-banner')).toBeNull();
    expect(screen.getByText('Noor Abeyratne')).toBeTruthy();
    expect(screen.getByText('ef'.repeat(32))).toBeTruthy();
    expect(screen.getByRole('link', { name: 'LaTeX' }).getAttribute('href')).toBe(`/api/records/${ID}/export?format=latex`);
    expect(screen.getByRole('link', { name: 'decuplet' }).getAttribute('href')).toBe(`/api/records/${ID}/uploads/decuplet`);
    expect(screen.getByLabelText('BibTeX entry').textContent).toContain(`@misc{cribra-${ID},`);
    expect(screen.getByLabelText('Verify command').textContent).toBe(record(false).verifyCommand);
    expect(screen.getByText('cribra-record-v2')).toBeTruthy();
  });

  it('shows the withdrawn banner with the reason above the record', async () => {
    mockFetch({ [`GET /api/records/${ID}`]: { body: record(true) } });
    renderRoutes(routes, `/records/${ID}`);
    const banner = await screen.findByTestId('withdrawn-banner');
    expect(banner.textContent).toContain('Superseded by a larger census.');
    expect(screen.getByRole('heading', { name: 'Gap patterns', level: 1 })).toBeTruthy();
  });

  it('shows a v1 cell\'s revision and uploads on its own line, not as raw record fields', async () => {
    const r = record(false);
    const v1 = { ...r.record, summary: r.summary, authors: r.authors, uploads: r.uploads, recordSha256: r.recordSha256 } as Record<string, unknown>;
    delete v1.recordFormat;
    v1.cells = [{ ...r.record.cells[0], cellRevision: 2, uploadsRead: ['decuplet'], claims: [{ verdict: 'holds' }], outputsBytes: 0, outputsComplete: true }];
    mockFetch({ [`GET /api/records/${ID}`]: { body: { ...r, record: v1 } } });
    renderRoutes(routes, `/records/${ID}`);
    const cell = await screen.findByRole('article', { name: 'Cell 1' });
    expect(cell.textContent).toContain('cell revision 2 · reads decuplet');
    expect(screen.queryByRole('region', { name: 'More of the record' })).toBeNull();
  });

  it('says there is no published record for an unknown id', async () => {
    mockFetch({});
    renderRoutes(routes, `/records/${ID}`);
    expect(await screen.findByRole('heading', { name: 'No published record here' })).toBeTruthy();
  });
});
