'use client';

import Link from 'next/link';
import { useMemo, useState } from 'react';
import useSWR from 'swr';
import { Badge } from '@/components/ui/badge';
import { Button, buttonClasses } from '@/components/ui/button';
import { Select } from '@/components/ui/select';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { TextField } from '@/components/ui/text-field';
import { useToast } from '@/components/ui/toast';
import type { DeskEnrollment, DeskOptions, DeskPage } from '@/lib/desk/enrollments';
import { Checklist } from './checklist';
import { fetchJson, postJson } from '@/lib/fetcher';
import { CERT_LABEL, CERT_TONE, STATUS_LABEL, STATUS_TONE, formatDate } from './labels';
import { RevokeDialog } from './revoke-dialog';

type Filters = { course: string; workshop: string; status: string; eligible: string; q: string };
const EMPTY_FILTERS: Filters = { course: '', workshop: '', status: '', eligible: '', q: '' };
const PAGE_SIZE = 25;
/** Enrollments per request when issuing in bulk: small enough to move the progress bar often. */
export const ISSUE_BATCH = 10;

/** The SWR key of one page of the table (exported so a caller can revalidate it). */
export function deskPageKey(filters: Filters, page: number): string {
  const params = new URLSearchParams({ page: String(page), pageSize: String(PAGE_SIZE) });
  for (const [k, v] of Object.entries(filters)) if (v) params.set(k, v);
  return `/api/desk/enrollments?${params}`;
}

type IssueResponse = { issued: number; existing: number; notEligible: number; notFound: number };
type Progress = { done: number; total: number; issued: number; skipped: number } | null;

export function CertificateDesk() {
  const toast = useToast();
  const [filters, setFilters] = useState<Filters>(EMPTY_FILTERS);
  const [page, setPage] = useState(1);
  const [selected, setSelected] = useState<Map<number, DeskEnrollment>>(new Map());
  const [progress, setProgress] = useState<Progress>(null);
  const [revoking, setRevoking] = useState<{ certificateId: number; serial: string; learnerName: string } | null>(null);
  const options = useSWR<DeskOptions>('/api/desk/options', fetchJson);
  const table = useSWR<DeskPage>(deskPageKey(filters, page), fetchJson, { keepPreviousData: true });

  const setFilter = (name: keyof Filters, value: string) => {
    setFilters((f) => ({ ...f, [name]: value, ...(name === 'course' ? { workshop: '' } : {}) }));
    setPage(1);
  };

  const items = table.data?.items ?? [];
  const allOnPage = items.length > 0 && items.every((i) => selected.has(i.id));
  const toggle = (row: DeskEnrollment) =>
    setSelected((s) => {
      const next = new Map(s);
      if (next.has(row.id)) next.delete(row.id);
      else next.set(row.id, row);
      return next;
    });
  const togglePage = () =>
    setSelected((s) => {
      const next = new Map(s);
      for (const row of items) {
        if (allOnPage) next.delete(row.id);
        else next.set(row.id, row);
      }
      return next;
    });

  const eligibleSelected = useMemo(() => [...selected.values()].filter((r) => r.eligible).map((r) => r.id), [selected]);

  async function issueSelected() {
    const ids = eligibleSelected;
    if (ids.length === 0) return;
    let issued = 0;
    let skipped = 0;
    setProgress({ done: 0, total: ids.length, issued, skipped });
    try {
      for (let i = 0; i < ids.length; i += ISSUE_BATCH) {
        const batch = ids.slice(i, i + ISSUE_BATCH);
        const result = await postJson<IssueResponse>('/api/desk/certificates', { enrollmentIds: batch });
        issued += result.issued;
        skipped += result.existing + result.notEligible + result.notFound;
        setProgress({ done: Math.min(i + batch.length, ids.length), total: ids.length, issued, skipped });
      }
      toast.show(
        `${issued} certificate${issued === 1 ? '' : 's'} issued${skipped ? `, ${skipped} skipped (already issued or no longer eligible)` : ''}.`,
        'success',
      );
      setSelected(new Map());
    } catch (e) {
      toast.show(e instanceof Error ? e.message : 'Issuing stopped on an error.', 'error');
    } finally {
      await table.mutate();
      setTimeout(() => setProgress(null), 1500);
    }
  }

  const rosterHref = useMemo(() => {
    if (selected.size > 0) return `/api/desk/roster?ids=${[...selected.keys()].join(',')}`;
    const params = new URLSearchParams();
    for (const [k, v] of Object.entries(filters)) if (v && k !== 'q') params.set(k, v);
    if (filters.q) params.set('q', filters.q);
    return `/api/desk/roster${params.size ? `?${params}` : ''}`;
  }, [filters, selected]);

  const courseOptions = [{ value: '', label: 'All courses' }, ...(options.data?.courses ?? []).map((c) => ({ value: c.slug, label: c.title }))];
  const workshopOptions = [
    { value: '', label: 'All workshops' },
    ...(options.data?.workshops ?? [])
      .filter((w) => !filters.course || w.courseSlug === filters.course)
      .map((w) => ({ value: String(w.id), label: `${formatDate(w.startsAt)} · ${w.place.split(',')[0]}` })),
  ];

  return (
    <div className="space-y-4">
      <form
        role="search"
        aria-label="Filter enrollments"
        className="grid gap-3 rounded-jar border border-brine-100 bg-white p-4 shadow-shelf md:grid-cols-5"
        onSubmit={(e) => e.preventDefault()}
      >
        <Select label="Course" value={filters.course} onChange={(e) => setFilter('course', e.target.value)} options={courseOptions} />
        <Select label="Workshop" value={filters.workshop} onChange={(e) => setFilter('workshop', e.target.value)} options={workshopOptions} />
        <Select
          label="Status"
          value={filters.status}
          onChange={(e) => setFilter('status', e.target.value)}
          options={[{ value: '', label: 'Any status' }, ...Object.entries(STATUS_LABEL).map(([value, label]) => ({ value, label }))]}
        />
        <Select
          label="Eligibility"
          value={filters.eligible}
          onChange={(e) => setFilter('eligible', e.target.value)}
          options={[
            { value: '', label: 'Everyone' },
            { value: 'yes', label: 'Eligible, not yet certified' },
            { value: 'no', label: 'Not eligible yet' },
            { value: 'certified', label: 'Certified' },
          ]}
        />
        <TextField label="Learner" type="search" placeholder="Name or e-mail" value={filters.q} onChange={(e) => setFilter('q', e.target.value)} />
      </form>

      <div className="flex flex-wrap items-center gap-3" aria-label="Bulk actions" role="group">
        <p className="text-sm text-ink-soft" aria-live="polite">
          {selected.size} selected{selected.size ? `, ${eligibleSelected.length} eligible` : ''}
        </p>
        <Button
          onClick={issueSelected}
          disabled={eligibleSelected.length === 0 || progress !== null}
          pending={progress !== null && progress.done < progress.total}
        >
          Issue certificates{eligibleSelected.length ? ` (${eligibleSelected.length})` : ''}
        </Button>
        <a className={buttonClasses('secondary')} href={rosterHref} download>
          Download the list (spreadsheet){selected.size ? ` — ${selected.size} chosen` : ''}
        </a>
        {selected.size ? (
          <Button variant="ghost" onClick={() => setSelected(new Map())}>
            Clear selection
          </Button>
        ) : null}
      </div>
      {progress ? (
        <div className="space-y-1">
          <label htmlFor="issue-progress" className="text-sm font-semibold">
            Issuing certificates: {progress.done} of {progress.total}
          </label>
          <progress id="issue-progress" className="h-3 w-full accent-copper-600" max={progress.total} value={progress.done} />
        </div>
      ) : null}

      {table.error ? (
        <div role="alert" className="rounded-lg border-l-4 border-beet-500 bg-beet-50 p-4 text-beet-700">
          Could not load the enrollments: {table.error.message}{' '}
          <button type="button" className="underline" onClick={() => table.mutate()}>
            Try again
          </button>
        </div>
      ) : null}

      <Table caption={`Enrollments${table.data ? ` (${table.data.total})` : ''}`} aria-busy={table.isLoading || table.isValidating || undefined}>
        <THead>
          <TR>
            <TH>
              <input
                type="checkbox"
                aria-label="Select every enrollment on this page"
                checked={allOnPage}
                onChange={togglePage}
                disabled={items.length === 0}
              />
            </TH>
            <TH>Learner</TH>
            <TH>Course and workshop</TH>
            <TH>Status</TH>
            <TH>Requirements</TH>
            <TH>Certificate</TH>
          </TR>
        </THead>
        <TBody>
          {table.isLoading ? (
            <EmptyRow colSpan={6}>Loading enrollments…</EmptyRow>
          ) : items.length === 0 ? (
            <EmptyRow colSpan={6}>No enrollments match these filters.</EmptyRow>
          ) : (
            items.map((row) => (
              <TR key={row.id}>
                <TD>
                  <input
                    type="checkbox"
                    aria-label={`Select ${row.learnerName}, ${row.courseTitle}`}
                    checked={selected.has(row.id)}
                    onChange={() => toggle(row)}
                  />
                </TD>
                <TD>
                  <span className="font-semibold">{row.learnerName}</span>
                  <span className="block text-xs text-ink-soft">{row.learnerEmail}</span>
                </TD>
                <TD>
                  {row.courseTitle}
                  <span className="block text-xs text-ink-soft">
                    {row.workshop ? `${formatDate(row.workshop.startsAt)} · ${row.workshop.place.split(',')[0]}` : 'No workshop'}
                  </span>
                </TD>
                <TD>
                  <Badge tone={STATUS_TONE[row.status]}>{STATUS_LABEL[row.status]}</Badge>
                  {row.eligible ? (
                    <Badge tone="copper" className="mt-1 block w-fit">
                      Eligible
                    </Badge>
                  ) : null}
                </TD>
                <TD className="min-w-64">
                  <Checklist checks={row.checks} />
                </TD>
                <TD>
                  {row.certificate ? (
                    <div className="space-y-1">
                      <Badge tone={CERT_TONE[row.certificate.state]}>{CERT_LABEL[row.certificate.state]}</Badge>
                      <span className="block font-mono text-xs">{row.certificate.serial}</span>
                      <span className="block text-xs text-ink-soft">until {formatDate(row.certificate.validUntil)}</span>
                      <span className="flex flex-wrap gap-2 text-xs">
                        <Link href={`/verify/${row.certificate.serial}`}>Verify</Link>
                        <a href={`/api/certificates/${row.certificate.serial}/pdf`}>PDF</a>
                        {row.certificate.state !== 'revoked' ? (
                          <button
                            type="button"
                            className="text-beet-700 underline"
                            onClick={() => setRevoking({ certificateId: row.certificate!.id, serial: row.certificate!.serial, learnerName: row.learnerName })}
                          >
                            Revoke<span className="sr-only"> {row.certificate.serial}</span>
                          </button>
                        ) : null}
                      </span>
                    </div>
                  ) : (
                    <span className="text-xs text-ink-soft">None yet</span>
                  )}
                </TD>
              </TR>
            ))
          )}
        </TBody>
      </Table>

      {table.data && table.data.pages > 1 ? (
        <nav aria-label="Pages of enrollments" className="flex items-center justify-between">
          <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => setPage((p) => p - 1)}>
            Previous page
          </Button>
          <span className="text-sm">
            Page {table.data.page} of {table.data.pages}
          </span>
          <Button variant="secondary" size="sm" disabled={page >= table.data.pages} onClick={() => setPage((p) => p + 1)}>
            Next page
          </Button>
        </nav>
      ) : null}

      <RevokeDialog target={revoking} onClose={() => setRevoking(null)} onDone={() => table.mutate()} />
    </div>
  );
}
