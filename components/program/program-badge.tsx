'use client';

import useSWR from 'swr';
import { fetchJson } from '@/lib/fetcher';

type Program = { name: string; shortName: string | null; logo: string | null };

/** The program's logo and short name beside the product name; a client leaf, so public pages stay static. */
export function ProgramBadge() {
  const { data } = useSWR('/api/program', (url: string) => fetchJson<Program>(url), { revalidateOnFocus: false });
  if (!data?.shortName) return null;
  return (
    <span data-testid="program-badge" className="flex items-center gap-2 border-l border-brine-600 pl-3 text-sm font-semibold text-brine-50">
      {data.logo ? (
        // eslint-disable-next-line @next/next/no-img-element -- a small PNG the app re-encoded, from its own route
        <img src={data.logo} alt="" width={28} height={28} className="h-7 w-auto rounded bg-white p-0.5" />
      ) : null}
      {data.shortName}
    </span>
  );
}
