import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SWRConfig } from 'swr';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ToastProvider } from '@/components/ui/toast';
import type { DeskEnrollment } from '@/lib/desk/enrollments';
import { CertificateDesk, ISSUE_BATCH } from './certificate-desk';

const checks = (met: boolean) => [
  { key: 'fee', label: 'Fee paid or waived', met: true, detail: 'Fee paid.' },
  { key: 'practical', label: 'Practical batch passed the table', met, detail: met ? 'Passed.' : 'No practical batch has passed the table yet.' },
];

const row = (id: number, eligible: boolean): DeskEnrollment => ({
  id,
  learnerName: `Learner ${id}`,
  learnerEmail: `l${id}@test.example`,
  courseSlug: 'pickling-and-canning',
  courseTitle: 'Safe Pickling and Water-Bath Canning',
  workshop: null,
  status: 'active',
  eligible,
  checks: checks(eligible) as DeskEnrollment['checks'],
  certificate: null,
});

function mockFetch(items: DeskEnrollment[]) {
  const posts: number[][] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input);
    if (url.startsWith('/api/desk/options')) return Response.json({ courses: [{ slug: 'pickling-and-canning', title: 'Safe Pickling' }], workshops: [] });
    if (url.startsWith('/api/desk/enrollments')) return Response.json({ items, total: items.length, page: 1, pageSize: 25, pages: 1 });
    if (url === '/api/desk/certificates' && init?.method === 'POST') {
      const ids = JSON.parse(String(init.body)).enrollmentIds as number[];
      posts.push(ids);
      return Response.json({ results: [], issued: ids.length, existing: 0, notEligible: 0, notFound: 0 });
    }
    return Response.json({ message: 'not mocked' }, { status: 404 });
  });
  vi.stubGlobal('fetch', fetchMock);
  return { posts, fetchMock };
}

const renderDesk = () =>
  render(
    <SWRConfig value={{ provider: () => new Map(), dedupingInterval: 0 }}>
      <ToastProvider>
        <CertificateDesk />
      </ToastProvider>
    </SWRConfig>,
  );

afterEach(() => vi.unstubAllGlobals());

describe('CertificateDesk', () => {
  it('shows each enrollment with its checklist and what is missing', async () => {
    mockFetch([row(1, true), row(2, false)]);
    renderDesk();
    const blocked = (await screen.findByText('Learner 2')).closest('tr')!;
    expect(within(blocked).getByText('1 missing')).toBeInTheDocument();
    expect(within(blocked).getByText(/No practical batch has passed the table yet/)).toBeInTheDocument();
    expect(within(screen.getByText('Learner 1').closest('tr')!).getByText('All requirements met')).toBeInTheDocument();
  });

  it('issues only the eligible selected enrollments, in batches, and reports the count', async () => {
    const items = [...Array.from({ length: 12 }, (_, i) => row(i + 1, true)), row(99, false)];
    const { posts } = mockFetch(items);
    renderDesk();
    await screen.findByText('Learner 99');
    await userEvent.click(screen.getByRole('checkbox', { name: 'Select every enrollment on this page' }));
    expect(screen.getByText('13 selected, 12 eligible')).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Issue certificates (12)' }));
    await screen.findByText('12 certificates issued.');
    expect(posts.map((p) => p.length)).toEqual([ISSUE_BATCH, 12 - ISSUE_BATCH]);
    expect(posts.flat()).not.toContain(99);
    await waitFor(() => expect(screen.getByText('0 selected')).toBeInTheDocument());
  }, 30_000);

  it('links the roster export to the selection or to the filters', async () => {
    mockFetch([row(5, true), row(6, true)]);
    renderDesk();
    await screen.findByText('Learner 5');
    const link = () => screen.getByRole('link', { name: /Download the list \(spreadsheet\)/ });
    expect(link()).toHaveAttribute('href', '/api/desk/roster');
    await userEvent.selectOptions(screen.getByLabelText('Eligibility'), 'yes');
    expect(link()).toHaveAttribute('href', '/api/desk/roster?eligible=yes');
    await userEvent.click(await screen.findByRole('checkbox', { name: /Select Learner 6/ }));
    expect(link()).toHaveAttribute('href', '/api/desk/roster?ids=6');
  }, 30_000);
});
