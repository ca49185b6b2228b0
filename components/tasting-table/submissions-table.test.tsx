import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SWRConfig } from 'swr';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

const search = vi.hoisted(() => ({ params: new URLSearchParams() }));
vi.mock('next/navigation', () => ({ useSearchParams: () => search.params }));

const { SubmissionsTable, filtersFromSearch, searchFromFilters } = await import('./submissions-table');

const workshops = [
  { id: 4, label: 'Dec 1, 2026 · Cedar Hollow Grange Hall' },
  { id: 9, label: 'Nov 11, 2026 · Cedar Hollow Grange Hall' },
];
/** The table with an SWR cache of its own, so no test sees another's answers. */
const renderTable = () =>
  render(
    <SWRConfig value={{ provider: () => new Map(), dedupingInterval: 0 }}>
      <SubmissionsTable workshops={workshops} />
    </SWRConfig>,
  );
const emptyPage = { rows: [], page: 1, pageSize: 20, total: 0, pageCount: 1, counts: { submitted: 0, changes_requested: 0, approved: 0 } };

describe('the Tasting table filters in the address', () => {
  const requested: string[] = [];
  beforeEach(() => {
    requested.length = 0;
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string) => {
        requested.push(url);
        return new Response(JSON.stringify(emptyPage), { status: 200, headers: { 'content-type': 'application/json' } });
      }),
    );
    window.history.replaceState(null, '', '/tasting-table');
  });
  afterEach(() => vi.unstubAllGlobals());

  it('reads them from the address with the data route schema, and drops what the form does not offer', () => {
    const from = (q: string) => filtersFromSearch(new URLSearchParams(q), workshops);
    expect(from('status=approved&workshop=9&flagged=yes&olderThanDays=7&sort=flags&page=3')).toEqual({
      page: 3,
      sort: 'flags',
      status: 'approved',
      workshop: '9',
      flagged: 'yes',
      olderThanDays: '7',
    });
    // An unknown workshop and an age that is not a choice fall back; a bad sort refuses the whole address.
    expect(from('workshop=77&olderThanDays=5')).toMatchObject({ workshop: '', olderThanDays: '' });
    expect(from('sort=sideways')).toEqual(from(''));
    expect(searchFromFilters(from(''))).toBe('');
    expect(searchFromFilters(from('flagged=yes&page=2'))).toBe('flagged=yes&page=2');
  });

  it('opens on the view the address names and writes each change back into it', async () => {
    search.params = new URLSearchParams('status=approved&page=2');
    window.history.replaceState(null, '', '/tasting-table?status=approved&page=2');
    renderTable();
    expect(screen.getByLabelText('Status')).toHaveValue('approved');
    await waitFor(() => expect(requested.some((u) => u.includes('status=approved') && u.includes('page=2'))).toBe(true));

    await userEvent.selectOptions(screen.getByLabelText('To double-check'), 'yes');
    // A new filter starts again at page 1, which is the default and so not written.
    await waitFor(() => expect(window.location.search).toBe('?status=approved&flagged=yes'));
    await waitFor(() => expect(requested.at(-1)).toContain('flagged=yes'));
    await userEvent.selectOptions(screen.getByLabelText('Status'), 'all');
    await waitFor(() => expect(window.location.search).toBe('?flagged=yes'));
  });

  it('says so when the address asks for a page past the last one, and goes back to page 1', async () => {
    // The data route answers an empty page 99 of a list that has 4 submissions on 1 page.
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string) => {
        requested.push(url);
        const page = Number(new URL(url, 'http://x').searchParams.get('page'));
        return new Response(JSON.stringify({ ...emptyPage, page, total: 4, counts: { submitted: 4, changes_requested: 0, approved: 0 } }), {
          status: 200,
          headers: { 'content-type': 'application/json' },
        });
      }),
    );
    search.params = new URLSearchParams('page=99');
    window.history.replaceState(null, '', '/tasting-table?page=99');
    renderTable();
    expect(await screen.findByText(/Page 99 is past the last page \(1\)\./)).toBeInTheDocument();
    expect(screen.queryByText('No submissions match these filters.')).toBeNull();
    await userEvent.click(screen.getByRole('button', { name: 'Go to page 1' }));
    await waitFor(() => expect(window.location.search).toBe(''));
    await waitFor(() => expect(requested.at(-1)).toContain('page=1'));
  });
});
