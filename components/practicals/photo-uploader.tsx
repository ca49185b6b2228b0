'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { MAX_PHOTOS } from '@/lib/validations/practical';

export type UploadedPhoto = { id: number; thumbnailUrl: string; width: number; height: number };

type Item = {
  key: string;
  file: File;
  status: 'uploading' | 'done' | 'error';
  progress: number;
  error?: string;
  photo?: UploadedPhoto;
};

const TEN_MB = 10 * 1024 * 1024;

/** Sends one photo with XMLHttpRequest so the upload's progress can be shown. */
function send(courseSlug: string, file: File, onProgress: (fraction: number) => void): Promise<UploadedPhoto> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    const form = new FormData();
    form.set('course', courseSlug);
    form.set('photo', file);
    xhr.open('POST', '/api/photos');
    xhr.responseType = 'json';
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      const body = xhr.response as { photo?: UploadedPhoto; message?: string } | null;
      if (xhr.status === 201 && body?.photo) resolve(body.photo);
      else reject(new Error(body?.message ?? `The upload failed (${xhr.status}).`));
    };
    xhr.onerror = () => reject(new Error('The connection dropped during the upload.'));
    xhr.send(form);
  });
}

/**
 * Each photo is its own upload with its own progress bar; a failed one can be retried or removed
 * without touching the rest of the form. Reports the ids of the uploaded photos, in order.
 */
export function PhotoUploader({
  courseSlug,
  onChange,
  describedBy,
  invalid,
}: {
  courseSlug: string;
  onChange: (ids: number[]) => void;
  describedBy?: string;
  invalid?: boolean;
}) {
  const [items, setItems] = useState<Item[]>([]);
  const input = useRef<HTMLInputElement>(null);
  const patch = useCallback((key: string, change: Partial<Item>) => setItems((all) => all.map((it) => (it.key === key ? { ...it, ...change } : it))), []);

  const start = useCallback(
    (item: Item) => {
      patch(item.key, { status: 'uploading', progress: 0, error: undefined });
      if (item.file.size > TEN_MB) {
        patch(item.key, { status: 'error', error: 'That photo is larger than 10 MB. Choose a smaller one.' });
        return;
      }
      send(courseSlug, item.file, (progress) => patch(item.key, { progress }))
        .then((photo) => patch(item.key, { status: 'done', progress: 1, photo }))
        .catch((error: Error) => patch(item.key, { status: 'error', error: error.message }));
    },
    [courseSlug, patch],
  );

  const ids = items.filter((it) => it.status === 'done' && it.photo).map((it) => it.photo!.id);
  const idKey = ids.join(',');
  useEffect(() => {
    onChange(idKey ? idKey.split(',').map(Number) : []);
    // onChange is the form's setter; only the ids matter here.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [idKey]);

  const add = (files: FileList | null) => {
    if (!files) return;
    const room = MAX_PHOTOS - items.length;
    const fresh = Array.from(files)
      .slice(0, Math.max(0, room))
      .map((file) => ({ key: `${file.name}-${file.size}-${Math.random().toString(36).slice(2)}`, file, status: 'uploading' as const, progress: 0 }));
    setItems((all) => [...all, ...fresh]);
    fresh.forEach(start);
    if (input.current) input.current.value = '';
  };

  return (
    <div className="space-y-3">
      <div>
        <label htmlFor="practical-photos" className="block text-sm font-semibold">
          Photos ({items.length} of {MAX_PHOTOS})
        </label>
        <p id="practical-photos-hint" className="text-sm text-ink-soft">
          2 to 6 photos: the packed jars before processing with the headspace visible, the jars after processing, and a close-up of a lid. JPEG, PNG or WebP, at
          most 10 MB each. Location and camera details are removed when a photo is saved.
        </p>
        <input
          ref={input}
          id="practical-photos"
          type="file"
          accept="image/jpeg,image/png,image/webp"
          multiple
          disabled={items.length >= MAX_PHOTOS}
          aria-describedby={['practical-photos-hint', describedBy].filter(Boolean).join(' ')}
          aria-invalid={invalid || undefined}
          onChange={(e) => add(e.target.files)}
          className="mt-2 block text-sm file:mr-3 file:rounded-lg file:border file:border-brine-600 file:bg-white file:px-3 file:py-1.5 file:font-semibold file:text-brine-800"
        />
      </div>
      {items.length ? (
        <ul className="grid gap-3 sm:grid-cols-2" aria-label="Photos in this submission">
          {items.map((item, index) => (
            <li key={item.key} className="flex gap-3 rounded-lg border border-brine-100 bg-white p-2" data-testid="photo-item">
              {item.photo ? (
                <img src={item.photo.thumbnailUrl} alt={`Photo ${index + 1}: ${item.file.name}`} className="h-16 w-16 rounded object-cover" />
              ) : (
                <div aria-hidden="true" className="flex h-16 w-16 items-center justify-center rounded bg-paper-deep text-2xl">
                  🫙
                </div>
              )}
              <div className="min-w-0 flex-1 space-y-1">
                <p className="truncate text-sm font-medium">{item.file.name}</p>
                {item.status === 'uploading' ? (
                  <progress className="h-2 w-full accent-brine-600" max={1} value={item.progress} aria-label={`Uploading ${item.file.name}`} />
                ) : null}
                {item.status === 'done' ? <p className="text-sm text-brine-700">Uploaded</p> : null}
                {item.status === 'error' ? (
                  <p className="text-sm text-beet-600" role="alert">
                    {item.error}
                  </p>
                ) : null}
                <div className="flex gap-2">
                  {item.status === 'error' ? (
                    <Button size="sm" variant="secondary" onClick={() => start(item)}>
                      Retry {item.file.name}
                    </Button>
                  ) : null}
                  {item.status !== 'uploading' ? (
                    <Button size="sm" variant="ghost" onClick={() => setItems((all) => all.filter((it) => it.key !== item.key))}>
                      Remove {item.file.name}
                    </Button>
                  ) : null}
                </div>
              </div>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
