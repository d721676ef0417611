import { json } from '@/lib/http';

export const dynamic = 'force-dynamic';

// Liveness: the server answers. No sign-in and no database (a load balancer's or a restart script's probe; the
// database's own health is seen on any signed-in request). `npm run bench:api` uses it as the floor of a route
// handler: what Next itself costs per request, before any work of ours.
export function GET(): Response {
  return json({ status: 'ok' });
}
