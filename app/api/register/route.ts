import { clientAddress } from '@/lib/auth/options';
import { countRegistration, registerLearner } from '@/lib/auth/users';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { RegisterSchema } from '@/lib/validations/user';

export const POST = route(async (request) => {
  const input = parseOrThrow(RegisterSchema, await readJson(request), 'registration form');
  await countRegistration(clientAddress(request.headers));
  const user = await registerLearner(input);
  return Response.json({ user: { id: user.id, email: user.email, name: user.name, roles: user.roles } }, { status: 201 });
});
