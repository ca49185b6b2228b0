import type { Metadata } from 'next';
import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { fetchAuditFilterOptions, fetchAuditPage } from '@/lib/audit/viewer';
import { requirePageRole } from '@/lib/auth/guard';
import { formatDateTime } from '@/lib/local-time';
import { getProgramIdentity } from '@/lib/program/settings';
import { AuditQuerySchema, type AuditQuery } from '@/lib/validations/audit';

export const metadata: Metadata = { title: 'Audit log at the Certificate desk' };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

/** The address of the same filters on another page. */
function pageHref(query: AuditQuery, page: number): string {
  const params = new URLSearchParams();
  if (query.person) params.set('person', String(query.person));
  if (query.action) params.set('action', query.action);
  if (query.from) params.set('from', query.from);
  if (query.to) params.set('to', query.to);
  if (page > 1) params.set('page', String(page));
  const text = params.toString();
  return text ? `/desk/audit?${text}` : '/desk/audit';
}

const field = 'mt-1 max-w-full rounded-lg border border-ink-faint/40 bg-white px-2 py-1.5 font-normal';

export default async function AuditLogPage({ searchParams }: Props) {
  await requirePageRole('/desk/audit', 'coordinator');
  const raw = await searchParams;
  const query = AuditQuerySchema.parse({ person: one(raw.person), action: one(raw.action), from: one(raw.from), to: one(raw.to), page: one(raw.page) });
  const program = await getProgramIdentity();
  const [log, options] = await Promise.all([fetchAuditPage(query, program.timeZone), fetchAuditFilterOptions()]);
  const filtered = Boolean(query.person || query.action || query.from || query.to);
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Audit log</h1>
      <p className="max-w-prose text-ink-soft">
        Who did what to which record, and when, newest first. Times are in the program’s time zone ({program.timeZone}); the dates of the filter are whole days
        there. Entries are only ever added.
      </p>
      <form method="get" action="/desk/audit" aria-label="Filter the audit log" className="flex flex-wrap items-end gap-3">
        <label className="flex min-w-0 max-w-full flex-col text-sm font-medium">
          Person
          <select name="person" defaultValue={query.person ? String(query.person) : ''} className={field}>
            <option value="">Anyone</option>
            {options.people.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name} ({p.email})
              </option>
            ))}
          </select>
        </label>
        <label className="flex min-w-0 max-w-full flex-col text-sm font-medium">
          Kind of action
          <select name="action" defaultValue={query.action ?? ''} className={field}>
            <option value="">Any action</option>
            {options.actions.map((a) => (
              <option key={a.action} value={a.action}>
                {a.words}
              </option>
            ))}
          </select>
        </label>
        <label className="flex min-w-0 max-w-full flex-col text-sm font-medium">
          From
          <input type="date" name="from" defaultValue={query.from ?? ''} className={field} />
        </label>
        <label className="flex min-w-0 max-w-full flex-col text-sm font-medium">
          To
          <input type="date" name="to" defaultValue={query.to ?? ''} className={field} />
        </label>
        <button type="submit" className="rounded-lg bg-brine-700 px-3 py-1.5 font-semibold text-white hover:bg-brine-800">
          Show
        </button>
        {filtered ? (
          <Link href="/desk/audit" className="py-1.5 text-sm">
            Clear the filters
          </Link>
        ) : null}
      </form>
      <Table
        caption={`${log.total.toLocaleString('en-US')} entr${log.total === 1 ? 'y' : 'ies'}${filtered ? ' matching the filters' : ''}, page ${log.page} of ${log.pages}`}
      >
        <THead>
          <TR>
            <TH>When</TH>
            <TH>Who</TH>
            <TH>Did what</TH>
            <TH>Record</TH>
          </TR>
        </THead>
        <TBody>
          {log.rows.length === 0 ? <EmptyRow colSpan={4}>No entry matches these filters.</EmptyRow> : null}
          {log.rows.map((r) => (
            <TR key={r.id}>
              <TD className="whitespace-nowrap">{formatDateTime(r.at, program.timeZone)}</TD>
              <TD>{r.actor ? r.actor.name : <Badge>Brinewright itself</Badge>}</TD>
              <TD>{r.words}</TD>
              <TD>{r.subject}</TD>
            </TR>
          ))}
        </TBody>
      </Table>
      {log.pages > 1 ? (
        <nav aria-label="Pages of the audit log" className="flex items-center gap-4">
          {log.page > 1 ? <Link href={pageHref(query, log.page - 1)}>← Newer entries</Link> : null}
          <span className="text-ink-soft">
            Page {log.page} of {log.pages}
          </span>
          {log.page < log.pages ? <Link href={pageHref(query, log.page + 1)}>Older entries →</Link> : null}
        </nav>
      ) : null}
    </div>
  );
}
