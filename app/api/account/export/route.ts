import { exportZip } from '@/lib/account/data';
import { requireRole } from '@/lib/auth/guard';
import { route } from '@/lib/errors';

// Any signed-in person: everything held about them, as one ZIP of JSON files and photos.
export const GET = route(async () => {
  const user = await requireRole();
  const zip = await exportZip(user.id);
  const day = new Date().toISOString().slice(0, 10);
  return new Response(new Uint8Array(zip), {
    headers: {
      'content-type': 'application/zip',
      'content-disposition': `attachment; filename="brinewright-my-data-${day}.zip"`,
      'cache-control': 'private, no-store',
    },
  });
});
