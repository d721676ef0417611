// A local stand-in for the payments provider's HTTP API, for `npm start` and `npm test`. The app talks to it through
// the provider's official Node SDK (`stripe`, pointed here with its host/port/protocol options). It answers the calls
// the app makes: Checkout Sessions (create, retrieve, expire) and Refunds (create); it serves a plain pay page at each
// session's URL and, when that page is submitted (or a session is expired), sends a signed webhook event to the app.
// Signature: the documented scheme, header `Stripe-Signature: t=<unix s>,v1=<hex HMAC-SHA256(secret, t + "." + body)>`.
//
// Test helpers (not part of the provider's API): GET /_fake/events lists every event sent, with the exact body,
// so a test can send the same bytes again.
import { createHmac, randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { dirname } from 'node:path';

export const WEBHOOK_PATH = '/api/webhooks/payments';

type Session = {
  id: string;
  object: 'checkout.session';
  mode: string;
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  customer_email: string | null;
  metadata: Record<string, string>;
  success_url: string;
  cancel_url: string | null;
  url: string | null;
  payment_intent: string | null;
  created: number;
  expires_at: number;
  livemode: false;
  description: string;
};

type SentEvent = { id: string; type: string; body: string; status: number };

const newId = (prefix: string) => `${prefix}_fake_${randomBytes(12).toString('hex')}`;
const now = () => Math.floor(Date.now() / 1000);

/** The documented signature header of a webhook body. */
export function signatureHeader(body: string, secret: string, t = now()): string {
  return `t=${t},v1=${createHmac('sha256', secret).update(`${t}.${body}`).digest('hex')}`;
}

/** The webhook secret for local runs: kept in `file` (generated on first use, `whsec_` + 64 hex characters). */
export function ensureWebhookSecret(file: string): string {
  if (existsSync(file)) {
    const kept = readFileSync(file, 'utf8').trim();
    if (/^whsec_\w{32,}$/.test(kept)) return kept;
  }
  mkdirSync(dirname(file), { recursive: true });
  const secret = `whsec_${randomBytes(32).toString('hex')}`;
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}

async function readBody(req: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of req) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

function send(res: ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { 'content-type': 'application/json' });
  res.end(JSON.stringify(body));
}

function apiError(res: ServerResponse, status: number, message: string, param?: string): void {
  send(res, status, { error: { type: 'invalid_request_error', message, ...(param ? { param } : {}) } });
}

const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function payPage(session: Session): string {
  const amount = `${(session.amount_total / 100).toFixed(2)} ${session.currency.toUpperCase()}`;
  const open = session.status === 'open';
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Test payment</title>
<style>body{font:16px/1.5 system-ui,sans-serif;max-width:32rem;margin:3rem auto;padding:0 1rem;color:#1a1a1a}
button,a.button{display:inline-block;min-height:44px;padding:0 1.25rem;font-size:16px;border-radius:6px;border:1px solid #1a1a1a}
button{background:#1a1a1a;color:#fff}</style></head><body>
<main><h1>Test payment</h1>
<p>This is the local payments stand-in: no card is charged.</p>
<p><strong>${escapeHtml(session.description)}</strong></p>
<p>Amount: <strong data-testid="amount">${escapeHtml(amount)}</strong></p>
${
  open
    ? `<form method="post" action="/pay/${escapeHtml(session.id)}"><button type="submit">Pay ${escapeHtml(amount)}</button></form>
${session.cancel_url ? `<p><a class="button" href="${escapeHtml(session.cancel_url)}">Back without paying</a></p>` : ''}`
    : `<p>This checkout is ${escapeHtml(session.status)}.</p>`
}
</main></body></html>`;
}

function parseForm(text: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of new URLSearchParams(text)) out[key] = value;
  return out;
}

function metadataOf(form: Record<string, string>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of Object.entries(form)) {
    const m = /^metadata\[(.+)\]$/.exec(key);
    if (m) out[m[1]] = value;
  }
  return out;
}

export async function startPaymentsFake(secretFile: string, port = 0): Promise<{ name: string; env: Record<string, string>; stop(): Promise<void> }> {
  const webhookSecret = ensureWebhookSecret(secretFile);
  const apiKey = `sk_test_fake_${randomBytes(12).toString('hex')}`;
  const sessions = new Map<string, Session>();
  const refunds = new Map<string, { id: string; amount: number; payment_intent: string }>();
  const sent: SentEvent[] = [];
  let base = '';

  async function deliver(type: string, object: unknown, successUrl: string): Promise<void> {
    const id = newId('evt');
    const body = JSON.stringify({ id, object: 'event', api_version: '2025-01-01', created: now(), livemode: false, type, data: { object } }, null, 2);
    const target = new URL(WEBHOOK_PATH, process.env.PAYMENTS_FAKE_WEBHOOK_URL ?? successUrl).toString();
    let status = 0;
    try {
      const res = await fetch(target, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': signatureHeader(body, webhookSecret) }, body });
      status = res.status;
      await res.arrayBuffer();
    } catch {
      status = -1; // the app was not reachable; the event stays listed for a replay
    }
    sent.push({ id, type, body, status });
  }

  const server = createServer((req, res) => {
    void (async () => {
      const url = new URL(req.url ?? '/', base);
      const path = url.pathname;
      const authorised = req.headers.authorization === `Bearer ${apiKey}`;
      if (path.startsWith('/v1/') && !authorised) return apiError(res, 401, 'Invalid API Key provided.');

      if (req.method === 'POST' && path === '/v1/checkout/sessions') {
        const form = parseForm(await readBody(req));
        const amount = Number(form['line_items[0][price_data][unit_amount]']);
        const currency = form['line_items[0][price_data][currency]'];
        if (!form.success_url) return apiError(res, 400, 'Missing required param: success_url.', 'success_url');
        if (!Number.isInteger(amount) || amount < 1) return apiError(res, 400, 'Invalid integer: unit_amount.', 'line_items[0][price_data][unit_amount]');
        if (!currency || !/^[a-z]{3}$/i.test(currency)) return apiError(res, 400, 'Invalid currency.', 'line_items[0][price_data][currency]');
        const id = newId('cs');
        const session: Session = {
          id,
          object: 'checkout.session',
          mode: form.mode ?? 'payment',
          status: 'open',
          payment_status: 'unpaid',
          amount_total: amount * Number(form['line_items[0][quantity]'] ?? 1),
          currency: currency.toLowerCase(),
          client_reference_id: form.client_reference_id ?? null,
          customer_email: form.customer_email ?? null,
          metadata: metadataOf(form),
          success_url: form.success_url,
          cancel_url: form.cancel_url ?? null,
          url: `${base}/pay/${id}`,
          payment_intent: null,
          created: now(),
          expires_at: Number(form.expires_at ?? now() + 24 * 3600),
          livemode: false,
          description: form['line_items[0][price_data][product_data][name]'] ?? 'Payment',
        };
        sessions.set(id, session);
        return send(res, 200, session);
      }
      let m = /^\/v1\/checkout\/sessions\/([^/]+)$/.exec(path);
      if (req.method === 'GET' && m) {
        const session = sessions.get(m[1]);
        return session ? send(res, 200, session) : apiError(res, 404, `No such checkout.session: '${m[1]}'`, 'session');
      }
      m = /^\/v1\/checkout\/sessions\/([^/]+)\/expire$/.exec(path);
      if (req.method === 'POST' && m) {
        await readBody(req);
        const session = sessions.get(m[1]);
        if (!session) return apiError(res, 404, `No such checkout.session: '${m[1]}'`, 'session');
        if (session.status !== 'open') return apiError(res, 400, `Only Checkout Sessions with a status in ["open"] can be expired.`);
        session.status = 'expired';
        session.url = null;
        await deliver('checkout.session.expired', session, session.success_url);
        return send(res, 200, session);
      }
      if (req.method === 'POST' && path === '/v1/refunds') {
        const form = parseForm(await readBody(req));
        const session = [...sessions.values()].find((s) => s.payment_intent && s.payment_intent === form.payment_intent);
        if (!session) return apiError(res, 400, `No such payment_intent: '${form.payment_intent ?? ''}'`, 'payment_intent');
        const already = [...refunds.values()].filter((r) => r.payment_intent === session.payment_intent).reduce((sum, r) => sum + r.amount, 0);
        const amount = form.amount ? Number(form.amount) : session.amount_total - already;
        if (amount < 1 || already + amount > session.amount_total) return apiError(res, 400, 'Charge has already been refunded.', 'amount');
        const refund = { id: newId('re'), object: 'refund', amount, currency: session.currency, payment_intent: session.payment_intent!, status: 'succeeded', created: now(), metadata: metadataOf(form) };
        refunds.set(refund.id, refund);
        return send(res, 200, refund);
      }

      m = /^\/pay\/([^/]+)$/.exec(path);
      if (m && (req.method === 'GET' || req.method === 'POST')) {
        const session = sessions.get(m[1]);
        if (!session) {
          res.writeHead(404, { 'content-type': 'text/plain' });
          return res.end('No such checkout.');
        }
        if (req.method === 'POST' && session.status === 'open') {
          await readBody(req);
          session.status = 'complete';
          session.payment_status = 'paid';
          session.payment_intent = newId('pi');
          await deliver('checkout.session.completed', session, session.success_url);
          res.writeHead(303, { location: session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id) });
          return res.end();
        }
        res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
        return res.end(payPage(session));
      }
      if (req.method === 'GET' && path === '/_fake/events') return send(res, 200, { events: sent });
      return apiError(res, 404, `Unrecognized request URL (${req.method}: ${path}).`);
    })().catch((error: unknown) => {
      if (!res.headersSent) apiError(res, 500, String(error));
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.address() as AddressInfo;
  base = `http://127.0.0.1:${address.port}`;
  return {
    name: `payments fake at ${base} (webhook secret in ${secretFile})`,
    env: {
      PAYMENTS_SECRET_KEY: apiKey,
      PAYMENTS_WEBHOOK_SECRET: webhookSecret,
      PAYMENTS_API_HOST: '127.0.0.1',
      PAYMENTS_API_PORT: String(address.port),
      PAYMENTS_API_PROTOCOL: 'http',
    },
    stop: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
