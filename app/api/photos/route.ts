import { requireRole } from '@/lib/auth/guard';
import { AppError, route } from '@/lib/errors';
import { acceptPhoto } from '@/lib/practicals/service';
import { readPhotoForm } from '@/lib/practicals/upload';

// One photo per request, so each gets its own progress bar and can be retried alone.
export const POST = route(async (request) => {
  const user = await requireRole('learner');
  const { file, fields } = await readPhotoForm(request);
  const course = fields.course ?? '';
  if (!/^[a-z0-9-]{1,80}$/.test(course)) throw new AppError('bad_request', 'Say which course the photo is for.', { fields: { course: ['Unknown course.'] } });
  const photo = await acceptPhoto(user, course, file);
  return Response.json({ photo }, { status: 201 });
});
