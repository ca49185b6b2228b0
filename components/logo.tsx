/** Brinewright's mark: a canning jar with a brine line and a dill sprig, drawn for this product. */
export function LogoMark({ className = 'h-9 w-9', title }: { className?: string; title?: string }) {
  return (
    <svg viewBox="0 0 48 48" className={className} role={title ? 'img' : undefined} aria-hidden={title ? undefined : true} aria-label={title}>
      <rect x="14" y="4" width="20" height="6" rx="1.5" fill="#b86a2e" />
      <rect x="13" y="9" width="22" height="3" rx="1" fill="#7b431d" />
      <path
        d="M12 14c0-1.1.9-2 2-2h20c1.1 0 2 .9 2 2v2c3 1.5 4 4 4 7v17a4 4 0 0 1-4 4H12a4 4 0 0 1-4-4V23c0-3 1-5.5 4-7z"
        fill="#eef6f3"
        stroke="#1f5043"
        strokeWidth="2"
      />
      <path d="M9 27c4-2.2 8-2.2 12 0s8 2.2 12 0 5-1.6 6-1.6V40a3 3 0 0 1-3 3H12a3 3 0 0 1-3-3z" fill="#4f9a80" />
      <path d="M24 41V22" stroke="#13302a" strokeWidth="1.6" strokeLinecap="round" />
      <path d="M24 26l-4-3M24 30l4-3M24 34l-4-3M24 38l4-3" stroke="#13302a" strokeWidth="1.4" strokeLinecap="round" />
    </svg>
  );
}

export function Logo() {
  return (
    <span className="inline-flex items-center gap-2">
      <LogoMark />
      <span className="font-display text-xl font-bold tracking-tight text-white">Brinewright</span>
    </span>
  );
}
