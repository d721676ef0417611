import { json, withErrors } from '@/lib/http';
import { handleEvent, verifyEvent } from '@/lib/reviews/webhook';

export const dynamic = 'force-dynamic';

const MAX_WEBHOOK_BYTES = 256 * 1024;

// POST from the payments provider: no session, no requireRole; the signature over the raw body (the SDK's
// constructEvent with the webhook secret) is what authenticates it. Bad signature: 400, nothing changes. A replayed
// event id: 200 { received: true, outcome: "replay" } without acting again.
export const POST = withErrors(async (request: Request) => {
  const raw = await request.text();
  if (raw.length > MAX_WEBHOOK_BYTES) return json({ error: { code: 'payload_too_large', message: 'Webhook body too large.' } }, 413);
  const event = verifyEvent(raw, request.headers.get('stripe-signature'));
  return json({ received: true, outcome: await handleEvent(event) });
});
