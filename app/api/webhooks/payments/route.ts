import { route } from '@/lib/errors';
import { handleEvent, verifyEvent } from '@/lib/payments/webhooks';
import { readBodyText, WEBHOOK_BODY_LIMIT } from '@/lib/server/body';

// Called by the payment service, not by a signed-in user: the signature on the raw body is the check.
export const POST = route(async (request) => {
  const raw = await readBodyText(request, WEBHOOK_BODY_LIMIT);
  const event = verifyEvent(raw, request.headers.get('stripe-signature'));
  const outcome = await handleEvent(event);
  return Response.json({ received: true, duplicate: outcome.duplicate, handled: outcome.handled });
});
