import { requireRole } from '@/lib/auth/guard';
import { AppError, route } from '@/lib/errors';
import { readPhotoFor } from '@/lib/practicals/service';

// Photos are never public files: each request checks that the viewer is the owner, an instructor or a coordinator.
export const GET = route<{ params: Promise<{ id: string }> }>(async (request, { params }) => {
  const viewer = await requireRole();
  const { id } = await params;
  if (!/^\d{1,10}$/.test(id)) throw new AppError('not_found', 'There is no such photo.');
  const size = new URL(request.url).searchParams.get('size') === 'thumb' ? 'thumb' : 'full';
  const photo = await readPhotoFor(viewer, Number(id), size);
  return new Response(new Uint8Array(photo.data), {
    headers: {
      'content-type': photo.contentType,
      'content-length': String(photo.data.length),
      'cache-control': 'private, max-age=3600',
      'x-content-type-options': 'nosniff',
    },
  });
});
