'use client';

import Link from 'next/link';
import { useHydrated } from '@/components/ui/use-hydrated';

/** Where the Tasting table keeps the query string of the view last shown in this tab. */
export const LAST_VIEW_KEY = 'brinewright:tasting-table-view';

export function rememberTableView(search: string) {
  try {
    window.sessionStorage.setItem(LAST_VIEW_KEY, search);
  } catch {
    // Storage refused (private mode, quota): the link back goes to the unfiltered table.
  }
}

function lastView(): string {
  try {
    return window.sessionStorage.getItem(LAST_VIEW_KEY) ?? '';
  } catch {
    return '';
  }
}

/** "All submissions": back to the Tasting table with the filters it last showed in this tab. */
export function BackToTable() {
  // The server's HTML (and hydration) link to the unfiltered table; the tab's last view after that.
  const search = useHydrated() ? lastView() : '';
  return <Link href={`/tasting-table${search ? `?${search}` : ''}`}>← All submissions</Link>;
}
