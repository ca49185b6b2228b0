'use client';

import { useEffect, useId, useRef, type ReactNode } from 'react';

type DialogProps = { open: boolean; onClose: () => void; title: string; children: ReactNode; footer?: ReactNode };

/** A modal built on the native <dialog>: focus is trapped and Escape closes it. */
export function Dialog({ open, onClose, title, children, footer }: DialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={onClose}
      onCancel={onClose}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-jar border border-brine-200 bg-white p-0 text-ink shadow-shelf backdrop:bg-ink/40"
    >
      <div className="p-5">
        <div className="mb-3 flex items-start justify-between gap-4">
          <h2 id={titleId} className="text-lg font-bold">
            {title}
          </h2>
          <button type="button" onClick={onClose} className="rounded px-2 text-xl leading-none text-ink-soft hover:bg-paper" aria-label="Close">
            ×
          </button>
        </div>
        {children}
      </div>
      {footer ? <div className="flex justify-end gap-2 border-t border-brine-50 bg-paper px-5 py-3">{footer}</div> : null}
    </dialog>
  );
}
