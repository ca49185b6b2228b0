'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { cn } from '@/lib/cn';

export type ViewerPhoto = { id: number; url: string; thumbnailUrl: string; width: number; height: number; caption: string | null };

const ZOOMS = [1, 1.5, 2, 3, 4] as const;

/** A photo viewer: pick a photo from the strip, zoom in steps, scroll (or drag the scrollbars) to pan. */
export function PhotoViewer({ photos, label = 'Photos' }: { photos: ViewerPhoto[]; label?: string }) {
  const [index, setIndex] = useState(0);
  const [zoom, setZoom] = useState(0);
  if (!photos.length) return <p className="text-sm text-ink-soft">No photos in this round.</p>;
  const photo = photos[Math.min(index, photos.length - 1)];
  const scale = ZOOMS[zoom];
  const pick = (i: number) => {
    setIndex(i);
    setZoom(0);
  };
  return (
    <section aria-label={label} className="space-y-3" data-testid="photo-viewer">
      <div className="flex flex-wrap items-center gap-2">
        <Button size="sm" variant="secondary" onClick={() => setZoom((z) => Math.max(0, z - 1))} disabled={zoom === 0}>
          Zoom out
        </Button>
        <Button size="sm" variant="secondary" onClick={() => setZoom((z) => Math.min(ZOOMS.length - 1, z + 1))} disabled={zoom === ZOOMS.length - 1}>
          Zoom in
        </Button>
        <Button size="sm" variant="ghost" onClick={() => setZoom(0)} disabled={zoom === 0}>
          Fit
        </Button>
        <span className="text-sm text-ink-soft" aria-live="polite" data-testid="zoom-level">
          {Math.round(scale * 100)} %
        </span>
        <a href={photo.url} target="_blank" rel="noreferrer" className="ml-auto text-sm">
          Open full size
        </a>
      </div>
      <div
        role="region"
        className="max-h-[70vh] overflow-auto rounded-lg border border-brine-100 bg-ink/5"
        tabIndex={0}
        aria-label={`Photo ${index + 1} of ${photos.length}, scroll to pan`}
      >
        <button
          type="button"
          className={cn('block', scale === 1 ? 'cursor-zoom-in' : 'cursor-zoom-out')}
          style={{ width: `${scale * 100}%` }}
          onClick={() => setZoom((z) => (z === 0 ? 2 : 0))}
          aria-label={scale === 1 ? 'Zoom in on this photo' : 'Back to the whole photo'}
        >
          {/* The photo route checks the viewer on each request; a plain img keeps the session cookie. */}
          <img src={photo.url} alt={photo.caption ?? `Photo ${index + 1}`} width={photo.width} height={photo.height} className="h-auto w-full" />
        </button>
      </div>
      <ul className="flex flex-wrap gap-2" aria-label="Choose a photo">
        {photos.map((p, i) => (
          <li key={p.id}>
            <button
              type="button"
              onClick={() => pick(i)}
              aria-pressed={i === index}
              className={cn('overflow-hidden rounded border-2', i === index ? 'border-copper-500' : 'border-transparent')}
            >
              <img src={p.thumbnailUrl} alt={`Show photo ${i + 1}${p.caption ? ` (${p.caption})` : ''}`} className="h-16 w-16 object-cover" />
            </button>
          </li>
        ))}
      </ul>
    </section>
  );
}
