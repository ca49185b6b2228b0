import { useId } from 'react';
import { cn } from '@/lib/cn';

/**
 * A preserving jar drawn in SVG, filled to `fill` (0, 0.5 or 1). Its accessible name says what the
 * fill means, e.g. "Acidity: read, quiz passed".
 */
export function Jar({ fill, label, className }: { fill: number; label: string; className?: string }) {
  const clip = useId().replace(/:/g, '');
  // Body of the jar from y=30 (shoulder) to y=112 (base); the contents rise from the base.
  const top = 30;
  const bottom = 112;
  const level = bottom - (bottom - top) * Math.max(0, Math.min(1, fill));
  return (
    <svg viewBox="0 0 80 120" role="img" aria-label={label} className={cn('h-28 w-20', className)} data-fill={fill}>
      <title>{label}</title>
      <defs>
        <clipPath id={`jar-${clip}`}>
          <path d="M16 30 Q16 24 22 22 L58 22 Q64 24 64 30 L66 104 Q66 112 58 112 L22 112 Q14 112 14 104 Z" />
        </clipPath>
      </defs>
      {/* Lid and band */}
      <rect x="18" y="6" width="44" height="10" rx="3" className="fill-copper-500" />
      <rect x="20" y="15" width="40" height="7" rx="2" className="fill-copper-700" />
      {/* Contents */}
      <g clipPath={`url(#jar-${clip})`}>
        <rect x="0" y={level} width="80" height={bottom - level + 2} className={fill >= 1 ? 'fill-brine-500' : 'fill-honey-500'} />
        {fill > 0 ? <path d={`M10 ${level} q10 -3 20 0 t20 0 t20 0 t20 0`} className="fill-none stroke-white/50" strokeWidth="1.5" /> : null}
        {fill >= 1 ? (
          <g className="fill-brine-700/70">
            <ellipse cx="30" cy="80" rx="5" ry="14" />
            <ellipse cx="48" cy="86" rx="5" ry="14" />
            <ellipse cx="39" cy="60" rx="4" ry="11" />
          </g>
        ) : null}
      </g>
      {/* Glass */}
      <path
        d="M16 30 Q16 24 22 22 L58 22 Q64 24 64 30 L66 104 Q66 112 58 112 L22 112 Q14 112 14 104 Z"
        className="fill-brine-50/30 stroke-brine-700"
        strokeWidth="2.5"
      />
      <path d="M22 36 L22 96" className="stroke-white/80" strokeWidth="3" strokeLinecap="round" />
    </svg>
  );
}
