'use client';

import { usePathname } from 'next/navigation';
import { useId, useState, type ReactNode } from 'react';

/**
 * The header's links behind one "Menu" button on a phone (a disclosure: the button says whether the
 * panel is open), laid out in a row from the md breakpoint up, where the button is not shown.
 */
export function HeaderMenu({ children }: { children: ReactNode }) {
  const pathname = usePathname();
  // Open for the page it was opened on: following a link inside closes it, so the next page starts in view.
  const [openOn, setOpenOn] = useState<string | null>(null);
  const open = openOn === pathname;
  const id = useId();
  return (
    <>
      <button
        type="button"
        aria-expanded={open}
        aria-controls={id}
        onClick={() => setOpenOn(open ? null : pathname)}
        className="ms-auto inline-flex items-center gap-2 rounded-lg border border-brine-400 px-3 py-1.5 text-sm font-semibold text-white hover:bg-brine-700 md:hidden"
      >
        <svg aria-hidden="true" viewBox="0 0 20 20" className="h-4 w-4" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round">
          {open ? <path d="M5 5l10 10M15 5L5 15" /> : <path d="M3 6h14M3 10h14M3 14h14" />}
        </svg>
        Menu
      </button>
      <div
        id={id}
        className={`${open ? 'flex' : 'hidden'} w-full flex-col gap-3 border-t border-brine-700 pt-3 md:flex md:w-auto md:flex-1 md:flex-row md:flex-wrap md:items-center md:gap-x-6 md:border-0 md:pt-0`}
      >
        {children}
      </div>
    </>
  );
}
