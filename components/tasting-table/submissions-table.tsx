'use client';

import Link from 'next/link';
import { useSearchParams } from 'next/navigation';
import { useEffect, useState } from 'react';
import useSWR from 'swr';
import { PRACTICAL_STATUS_LABEL, PRACTICAL_STATUS_TONE } from '@/components/practicals/practical-status';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/select';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import type { TastingTablePage, WorkshopOption } from '@/lib/practicals/data';
import { PRODUCTS } from '@/lib/preserving/products';
import { tastingTableQuerySchema, type TastingSort } from '@/lib/validations/practical';
import { rememberTableView } from './back-to-table';
import { fetchJson } from '@/lib/fetcher';
import { formatShortDate } from '@/lib/local-time';
import { batchName } from '@/lib/practicals/words';

type Filters = { page: number; sort: TastingSort; status: string; workshop: string; flagged: string; olderThanDays: string };

const STATUS_OPTIONS = [
  { value: 'all', label: 'Every status' },
  ...(['submitted', 'changes_requested', 'approved'] as const).map((value) => ({ value, label: PRACTICAL_STATUS_LABEL[value] })),
];
const FLAG_OPTIONS = [
  { value: 'any', label: 'Either' },
  { value: 'yes', label: 'Something to double-check' },
  { value: 'no', label: 'Nothing to double-check' },
];
const AGE_OPTIONS = [
  { value: '', label: 'Any age' },
  { value: '2', label: 'Waiting 2 days or more' },
  { value: '7', label: 'Waiting 7 days or more' },
  { value: '14', label: 'Waiting 14 days or more' },
];
const SORT_OPTIONS: { value: TastingSort; label: string }[] = [
  { value: 'oldest', label: 'Oldest first' },
  { value: 'newest', label: 'Newest first' },
  { value: 'flags', label: 'Most to double-check first' },
  { value: 'learner', label: 'Learner name' },
  { value: 'status', label: 'Status' },
];

const DEFAULT_FILTERS: Filters = { page: 1, sort: 'oldest', status: 'all', workshop: '', flagged: 'any', olderThanDays: '' };
const offered = (options: { value: string }[], value: string, fallback: string) => (options.some((o) => o.value === value) ? value : fallback);

/**
 * The filters a page address asks for, read with the data route's own schema; a value the form
 * does not offer (an unknown workshop, an age that is not a choice) falls back to the default.
 */
export function filtersFromSearch(params: URLSearchParams | null, workshops: WorkshopOption[]): Filters {
  const parsed = tastingTableQuerySchema.safeParse(Object.fromEntries(params ?? []));
  if (!parsed.success) return DEFAULT_FILTERS;
  const q = parsed.data;
  return {
    page: q.page,
    sort: q.sort,
    status: q.status,
    workshop: q.workshop && workshops.some((w) => w.id === q.workshop) ? String(q.workshop) : '',
    flagged: q.flagged,
    olderThanDays: offered(AGE_OPTIONS, q.olderThanDays === undefined ? '' : String(q.olderThanDays), ''),
  };
}

/** The page's own query string for a set of filters: only what differs from the defaults. */
export function searchFromFilters(f: Filters): string {
  const q = new URLSearchParams();
  for (const key of ['status', 'workshop', 'flagged', 'olderThanDays', 'sort', 'page'] as const) {
    if (String(f[key]) !== String(DEFAULT_FILTERS[key])) q.set(key, String(f[key]));
  }
  return q.toString();
}

/** The data route's URL for a set of filters (exported for tests and prefetching). */
export function submissionsKey(f: Filters): string {
  const q = new URLSearchParams({ page: String(f.page), sort: f.sort, status: f.status, flagged: f.flagged });
  if (f.workshop) q.set('workshop', f.workshop);
  if (f.olderThanDays) q.set('olderThanDays', f.olderThanDays);
  return `/api/tasting-table/submissions?${q}`;
}

function age(iso: string, now: number): string {
  const days = Math.floor((now - new Date(iso).getTime()) / 86_400_000);
  if (days <= 0) return 'today';
  return days === 1 ? '1 day' : `${days.toLocaleString('en-US')} days`;
}

const productName = (id: string | null) => (id && id in PRODUCTS ? PRODUCTS[id as keyof typeof PRODUCTS].name : (id ?? '—'));

/** The queue of practical submissions: server-paginated, sortable and filterable, fetched with SWR. */
export function SubmissionsTable({ workshops }: { workshops: WorkshopOption[] }) {
  // The filters live in the address too, so a reload, a shared link or the browser's back button
  // from a submission brings the same view back.
  const searchParams = useSearchParams();
  const [filters, setFilters] = useState<Filters>(() => filtersFromSearch(searchParams, workshops));
  useEffect(() => {
    const search = searchFromFilters(filters);
    const url = `${window.location.pathname}${search ? `?${search}` : ''}`;
    if (url !== `${window.location.pathname}${window.location.search}`) window.history.replaceState(null, '', url);
    rememberTableView(search);
  }, [filters]);
  const { data, error, isLoading, isValidating, mutate } = useSWR<TastingTablePage>(submissionsKey(filters), fetchJson, { keepPreviousData: true });
  const set = (change: Partial<Filters>) => setFilters((f) => ({ ...f, page: 1, ...change }));
  const [now] = useState(() => Date.now());
  const sortHeader = (label: string, sort: TastingSort) => (
    <button
      type="button"
      className="font-semibold underline decoration-dotted underline-offset-2"
      onClick={() => set({ sort })}
      aria-pressed={filters.sort === sort}
    >
      {label}
      {filters.sort === sort ? <span aria-hidden="true"> ▲</span> : null}
    </button>
  );

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap gap-2" aria-label="Submissions in each status" role="group">
        {(['submitted', 'changes_requested', 'approved'] as const).map((s) => (
          <button
            key={s}
            type="button"
            onClick={() => set({ status: filters.status === s ? 'all' : s })}
            aria-pressed={filters.status === s}
            className="rounded-full focus-visible:outline-2 focus-visible:outline-copper-500"
          >
            <Badge tone={PRACTICAL_STATUS_TONE[s]} className={filters.status === s ? 'ring-2' : undefined}>
              {PRACTICAL_STATUS_LABEL[s]}:
              <span className="ms-1" data-testid={`count-${s}`}>
                {data ? data.counts[s] : '…'}
              </span>
            </Badge>
          </button>
        ))}
      </div>

      <div className="grid gap-3 md:grid-cols-5">
        <Select label="Status" options={STATUS_OPTIONS} value={filters.status} onChange={(e) => set({ status: e.target.value })} />
        <Select
          label="Workshop"
          options={[{ value: '', label: 'Every workshop' }, ...workshops.map((w) => ({ value: String(w.id), label: w.label }))]}
          value={filters.workshop}
          onChange={(e) => set({ workshop: e.target.value })}
        />
        <Select label="To double-check" options={FLAG_OPTIONS} value={filters.flagged} onChange={(e) => set({ flagged: e.target.value })} />
        <Select label="Age" options={AGE_OPTIONS} value={filters.olderThanDays} onChange={(e) => set({ olderThanDays: e.target.value })} />
        <Select label="Sort" options={SORT_OPTIONS} value={filters.sort} onChange={(e) => set({ sort: e.target.value as TastingSort })} />
      </div>

      {error ? (
        <div role="alert" className="flex items-center justify-between rounded-lg border border-beet-500 bg-beet-50 px-4 py-3 text-sm text-beet-700">
          <span>The submissions could not be loaded: {(error as Error).message}</span>
          <Button size="sm" variant="secondary" onClick={() => mutate()}>
            Try again
          </Button>
        </div>
      ) : null}

      <Table caption={<span>Practical submissions{data ? ` (${data.total})` : ''}</span>} aria-busy={isLoading || isValidating || undefined}>
        <THead>
          <tr>
            <TH>{sortHeader('Learner', 'learner')}</TH>
            <TH>Product</TH>
            <TH>Batch</TH>
            <TH>{sortHeader('Status', 'status')}</TH>
            <TH>{sortHeader('To double-check', 'flags')}</TH>
            <TH>Workshop</TH>
            <TH>{sortHeader('Age', 'oldest')}</TH>
          </tr>
        </THead>
        <TBody>
          {!data && isLoading ? (
            <EmptyRow colSpan={7}>Loading submissions…</EmptyRow>
          ) : data && data.rows.length === 0 && data.total > 0 ? (
            // An address (or a list that shrank) asking for a page past the last one.
            <EmptyRow colSpan={7}>
              Page {filters.page} is past the last page ({data.pageCount}).{' '}
              <button type="button" className="font-semibold underline" onClick={() => setFilters((f) => ({ ...f, page: 1 }))}>
                Go to page 1
              </button>
            </EmptyRow>
          ) : data && data.rows.length === 0 ? (
            <EmptyRow colSpan={7}>No submissions match these filters.</EmptyRow>
          ) : (
            data?.rows.map((row) => (
              <TR key={row.id} data-testid="submission-row">
                <TD>
                  <Link href={`/tasting-table/submissions/${row.id}`} className="font-semibold">
                    {row.learnerName}
                  </Link>
                </TD>
                <TD>{productName(row.product)}</TD>
                <TD>{batchName(row.round)}</TD>
                <TD>
                  <Badge tone={PRACTICAL_STATUS_TONE[row.status]}>{PRACTICAL_STATUS_LABEL[row.status]}</Badge>
                </TD>
                <TD>{row.flagCount ? <Badge tone="honey">{`⚑ ${row.flagCount}`}</Badge> : <span className="text-ink-soft">nothing</span>}</TD>
                <TD>
                  {row.workshopPlace
                    ? `${formatShortDate(row.workshopStartsAt!, row.workshopTimeZone ?? 'UTC')} · ${row.workshopPlace.split(',')[0]}`
                    : 'Self-paced'}
                </TD>
                <TD>
                  <time dateTime={row.submittedAt}>{age(row.submittedAt, now)}</time>
                </TD>
              </TR>
            ))
          )}
        </TBody>
      </Table>

      <nav aria-label="Pages of submissions" className="flex items-center justify-between gap-3 text-sm">
        <Button size="sm" variant="secondary" disabled={filters.page <= 1} onClick={() => setFilters((f) => ({ ...f, page: f.page - 1 }))}>
          Previous page
        </Button>
        <span>
          Page {data?.page ?? filters.page} of {data?.pageCount ?? '…'}
        </span>
        <Button
          size="sm"
          variant="secondary"
          disabled={!data || filters.page >= data.pageCount}
          onClick={() => setFilters((f) => ({ ...f, page: f.page + 1 }))}
        >
          Next page
        </Button>
      </nav>
    </div>
  );
}
