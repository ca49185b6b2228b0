// A local stand-in for the hosted payment service, spoken to by the real `stripe` SDK through its
// host/port/protocol options. It keeps everything in memory, serves a practice card form, and delivers
// webhooks signed with the SDK's own generateTestHeaderString, retrying with backoff until the app
// answers 2xx.
import crypto from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { decodeForm } from './form';
import { CARDS, luhnValid, spaced } from './cards';
import { checkoutPage } from './page';

export { CARDS } from './cards';

export type FakeSession = {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  customer_email: string | null;
  customer_details: { email: string | null } | null;
  metadata: Record<string, string>;
  mode: string;
  payment_intent: string | null;
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string | null;
  cancel_url: string | null;
  url: string | null;
  created: number;
  expires_at: number;
  livemode: false;
  line_items_name: string;
};

export type FakeRefund = {
  id: string;
  object: 'refund';
  amount: number;
  currency: string;
  payment_intent: string;
  status: 'succeeded';
  reason: string | null;
  metadata: Record<string, string>;
  created: number;
};

export type Delivery = {
  eventId: string;
  type: string;
  payload: string;
  attempts: number;
  delivered: boolean;
  lastStatus: number | null;
  lastError: string | null;
  /** When the next attempt is due; null when none is scheduled. */
  nextAt: number | null;
  inFlight?: boolean;
};

export type FakePaymentsOptions = {
  port?: number;
  host?: string;
  /** Where events go, e.g. http://127.0.0.1:3000/api/webhooks/payments. None: events are only recorded. */
  webhookUrl?: string;
  webhookSecret: string;
  /** When given, API calls must carry `Authorization: Bearer <apiKey>`. */
  apiKey?: string;
  /** First retry delay; each next one doubles, up to maxRetryMs. */
  retryBaseMs?: number;
  maxRetryMs?: number;
  maxAttempts?: number;
  /** How often sessions past expires_at are expired (ms). */
  sweepMs?: number;
  log?: (line: string) => void;
};

export type FakePayments = {
  url: string;
  port: number;
  sessions: Map<string, FakeSession>;
  refunds: Map<string, FakeRefund>;
  deliveries: Delivery[];
  /** Completes (or declines) a session as the card form would; answers where the browser goes next. */
  pay(sessionId: string, card: string): { ok: boolean; error?: string; redirect?: string };
  /** Expires an open session as if its time had run out (sends checkout.session.expired). */
  expire(sessionId: string): boolean;
  /** Sends an already-sent event again, as the service does on a retry. */
  redeliver(eventId: string): Promise<void>;
  setWebhookUrl(url: string | undefined): void;
  /** Resolves once every queued delivery has been answered 2xx or given up. */
  settle(timeoutMs?: number): Promise<void>;
  close(): Promise<void>;
};

const API_VERSION = '2026-10-28.endive';
const now = () => Math.floor(Date.now() / 1000);
const randomId = (prefix: string) => `${prefix}_test_${crypto.randomBytes(12).toString('hex')}`;
const digits = (s: string) => s.replace(/[\s-]/g, '');

function stripeError(res: http.ServerResponse, status: number, type: string, message: string, code?: string, param?: string) {
  send(res, status, { error: { type, message, ...(code ? { code } : {}), ...(param ? { param } : {}) } });
}

function send(res: http.ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}) {
  res.writeHead(status, { 'content-type': 'application/json', 'request-id': randomId('req'), ...headers });
  res.end(JSON.stringify(body));
}

function readBody(req: http.IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    let body = '';
    req.setEncoding('utf8');
    req.on('data', (chunk) => {
      body += chunk;
      if (body.length > 1_000_000) req.destroy(new Error('body too large'));
    });
    req.on('end', () => resolve(body));
    req.on('error', reject);
  });
}

function cardCheck(values: Record<string, string>): string | null {
  const card = digits(values.card ?? '');
  if (!/^\d{12,19}$/.test(card)) return 'Type the card number: 12 to 19 digits, spaces allowed.';
  if (!luhnValid(card)) return 'One of the digits of that card number is mistyped: check it against the card.';
  const exp = /^(\d{2})\s*\/\s*(\d{2})$/.exec(values.exp ?? '');
  if (!exp || Number(exp[1]) < 1 || Number(exp[1]) > 12) return 'Type the expiry date as month and year, like 09/31.';
  const end = new Date(Date.UTC(2000 + Number(exp[2]), Number(exp[1]), 1));
  if (end.getTime() <= Date.now()) return 'That expiry date has passed: use a date still to come.';
  if (!/^\d{3,4}$/.test(values.cvc ?? '')) return 'Type the security code: the 3 or 4 digits on the card.';
  return null;
}

export function startFakePayments(options: FakePaymentsOptions): Promise<FakePayments> {
  const log = options.log ?? (() => {});
  const signer = new Stripe('sk_test_fake_signer', { telemetry: false });
  const sessions = new Map<string, FakeSession>();
  const refunds = new Map<string, FakeRefund>();
  const intents = new Map<string, { id: string; amount: number; currency: string; refunded: number; session: string }>();
  const idempotent = new Map<string, { status: number; body: unknown }>();
  const deliveries: Delivery[] = [];
  const timers = new Set<NodeJS.Timeout>();
  let webhookUrl = options.webhookUrl;
  let baseUrl = '';
  let closed = false;
  // While paused (a control call the browser tests make), deliveries wait instead of going out.
  let paused = false;
  const held: Delivery[] = [];
  const retryBase = options.retryBaseMs ?? 1000;
  const maxRetry = options.maxRetryMs ?? 60_000;
  const maxAttempts = options.maxAttempts ?? 12;

  function later(fn: () => void, ms: number) {
    const t = setTimeout(() => {
      timers.delete(t);
      fn();
    }, ms);
    timers.add(t);
  }

  async function attempt(delivery: Delivery) {
    delivery.nextAt = null;
    if (closed || !webhookUrl) return;
    if (paused) {
      held.push(delivery);
      return;
    }
    delivery.attempts += 1;
    delivery.inFlight = true;
    try {
      await deliverOnce(delivery, webhookUrl);
    } finally {
      delivery.inFlight = false;
    }
  }

  async function deliverOnce(delivery: Delivery, url: string) {
    const header = signer.webhooks.generateTestHeaderString({ payload: delivery.payload, secret: options.webhookSecret });
    try {
      const response = await fetch(url, {
        method: 'POST',
        headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': header, 'user-agent': 'brinewright-fake-payments/1.0' },
        body: delivery.payload,
        signal: AbortSignal.timeout(10_000),
      });
      delivery.lastStatus = response.status;
      await response.arrayBuffer().catch(() => undefined);
      if (response.ok) {
        delivery.delivered = true;
        delivery.lastError = null;
        log(`webhook ${delivery.type} ${delivery.eventId} delivered (attempt ${delivery.attempts})`);
        return;
      }
      delivery.lastError = `HTTP ${response.status}`;
    } catch (error) {
      delivery.lastStatus = null;
      delivery.lastError = error instanceof Error ? error.message : String(error);
    }
    if (delivery.attempts >= maxAttempts) {
      log(`webhook ${delivery.type} ${delivery.eventId} given up after ${delivery.attempts} attempts: ${delivery.lastError}`);
      return;
    }
    const wait = Math.min(maxRetry, retryBase * 2 ** (delivery.attempts - 1));
    delivery.nextAt = Date.now() + wait;
    log(`webhook ${delivery.type} ${delivery.eventId} failed (${delivery.lastError}); retry in ${wait} ms`);
    later(() => void attempt(delivery), wait);
  }

  function emit(type: string, object: unknown): Delivery {
    const event = {
      id: randomId('evt'),
      object: 'event',
      api_version: API_VERSION,
      created: now(),
      data: { object },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
    };
    const delivery: Delivery = {
      eventId: event.id,
      type,
      payload: JSON.stringify(event, null, 2),
      attempts: 0,
      delivered: false,
      lastStatus: null,
      lastError: null,
      nextAt: Date.now(),
    };
    deliveries.push(delivery);
    later(() => void attempt(delivery), 0);
    return delivery;
  }

  function publicSession(s: FakeSession) {
    const { line_items_name: _name, ...rest } = s;
    return rest;
  }

  function expire(sessionId: string): boolean {
    const s = sessions.get(sessionId);
    if (!s || s.status !== 'open') return false;
    s.status = 'expired';
    s.url = null;
    emit('checkout.session.expired', publicSession(s));
    return true;
  }

  function pay(sessionId: string, card: string): { ok: boolean; error?: string; redirect?: string } {
    const s = sessions.get(sessionId);
    if (!s) return { ok: false, error: 'There is no practice payment with that address.' };
    if (s.status !== 'open') return { ok: false, error: s.status === 'complete' ? 'This fee is already paid.' : 'This practice payment has closed.' };
    const number = digits(card);
    if (number === CARDS.declined) return { ok: false, error: 'The card’s bank turned this payment down, so nothing was paid. Try another card.' };
    if (number !== CARDS.pays)
      return {
        ok: false,
        error: `This practice page takes only its practice numbers: ${spaced(CARDS.pays)} goes through, ${spaced(CARDS.declined)} is turned down.`,
      };
    const intent = randomId('pi');
    intents.set(intent, { id: intent, amount: s.amount_total, currency: s.currency, refunded: 0, session: s.id });
    s.status = 'complete';
    s.payment_status = 'paid';
    s.payment_intent = intent;
    s.url = null;
    emit('checkout.session.completed', publicSession(s));
    const redirect = s.success_url?.replace('{CHECKOUT_SESSION_ID}', s.id) ?? undefined;
    return { ok: true, redirect };
  }

  function createSession(params: Record<string, unknown>): { status: number; body: unknown } {
    const items = (params.line_items as Array<Record<string, unknown>> | undefined) ?? [];
    if (params.mode !== 'payment')
      return {
        status: 400,
        body: { error: { type: 'invalid_request_error', message: 'The practice server takes one-off payments only (mode=payment).', param: 'mode' } },
      };
    if (!items.length)
      return {
        status: 400,
        body: { error: { type: 'invalid_request_error', message: 'line_items is missing: say what is being paid for.', param: 'line_items' } },
      };
    let total = 0;
    let currency = '';
    const names: string[] = [];
    for (const item of items) {
      const price = item.price_data as Record<string, unknown> | undefined;
      const amount = Number(price?.unit_amount);
      const quantity = Number(item.quantity ?? 1);
      if (!price || !Number.isInteger(amount) || amount < 0 || !price.currency) {
        return {
          status: 400,
          body: {
            error: { type: 'invalid_request_error', message: 'Every line item needs price_data with a currency and a unit_amount.', param: 'line_items' },
          },
        };
      }
      total += amount * quantity;
      currency = String(price.currency).toLowerCase();
      names.push(String((price.product_data as Record<string, unknown> | undefined)?.name ?? 'Item'));
    }
    if (!params.success_url)
      return {
        status: 400,
        body: { error: { type: 'invalid_request_error', message: 'success_url is missing: say where the browser goes after paying.', param: 'success_url' } },
      };
    const created = now();
    const expiresAt = params.expires_at ? Number(params.expires_at) : created + 24 * 3600;
    if (expiresAt < created + 30 * 60 - 5 || expiresAt > created + 24 * 3600 + 5) {
      return {
        status: 400,
        body: { error: { type: 'invalid_request_error', message: 'expires_at has to fall between 30 minutes and 24 hours from now.', param: 'expires_at' } },
      };
    }
    const id = randomId('cs');
    const email = (params.customer_email as string | undefined) ?? null;
    const session: FakeSession = {
      id,
      object: 'checkout.session',
      amount_subtotal: total,
      amount_total: total,
      currency,
      client_reference_id: (params.client_reference_id as string | undefined) ?? null,
      customer_email: email,
      customer_details: email ? { email } : null,
      metadata: (params.metadata as Record<string, string> | undefined) ?? {},
      mode: 'payment',
      payment_intent: null,
      payment_status: 'unpaid',
      status: 'open',
      success_url: String(params.success_url),
      cancel_url: (params.cancel_url as string | undefined) ?? null,
      url: `${baseUrl}/pay/${id}`,
      created,
      expires_at: expiresAt,
      livemode: false,
      line_items_name: names.join(', '),
    };
    sessions.set(id, session);
    log(`checkout session ${id} for ${total} ${currency}`);
    return { status: 200, body: publicSession(session) };
  }

  function createRefund(params: Record<string, unknown>): { status: number; body: unknown } {
    const intentId = String(params.payment_intent ?? '');
    const intent = intents.get(intentId);
    if (!intent)
      return {
        status: 404,
        body: {
          error: {
            type: 'invalid_request_error',
            code: 'resource_missing',
            message: `The practice server has no payment_intent '${intentId}'.`,
            param: 'payment_intent',
          },
        },
      };
    const left = intent.amount - intent.refunded;
    const amount = params.amount === undefined ? left : Number(params.amount);
    if (left <= 0)
      return {
        status: 400,
        body: { error: { type: 'invalid_request_error', code: 'charge_already_refunded', message: 'Every cent of this payment has been refunded already.' } },
      };
    if (!Number.isInteger(amount) || amount <= 0 || amount > left)
      return {
        status: 400,
        body: { error: { type: 'invalid_request_error', code: 'amount_too_large', message: `A refund here can be from 1 to ${left} cents.`, param: 'amount' } },
      };
    intent.refunded += amount;
    const refund: FakeRefund = {
      id: randomId('re'),
      object: 'refund',
      amount,
      currency: intent.currency,
      payment_intent: intent.id,
      status: 'succeeded',
      reason: (params.reason as string | undefined) ?? null,
      metadata: (params.metadata as Record<string, string> | undefined) ?? {},
      created: now(),
    };
    refunds.set(refund.id, refund);
    // The hosted service also announces refunds; the app does not need this event and answers 200.
    emit('charge.refunded', {
      id: randomId('ch'),
      object: 'charge',
      amount: intent.amount,
      amount_refunded: intent.refunded,
      payment_intent: intent.id,
      refunded: intent.refunded >= intent.amount,
    });
    return { status: 200, body: refund };
  }

  async function api(req: http.IncomingMessage, res: http.ServerResponse, path: string) {
    if (options.apiKey && req.headers.authorization !== `Bearer ${options.apiKey}`) {
      return stripeError(res, 401, 'invalid_request_error', 'Invalid API Key provided.');
    }
    const raw = req.method === 'POST' ? await readBody(req) : '';
    const params = decodeForm(raw);
    const key = req.headers['idempotency-key'];
    const idemKey = typeof key === 'string' && req.method === 'POST' ? `${path}|${key}` : null;
    if (idemKey && idempotent.has(idemKey)) {
      const saved = idempotent.get(idemKey)!;
      return send(res, saved.status, saved.body, { 'idempotent-replayed': 'true' });
    }
    let result: { status: number; body: unknown } | null = null;
    let m: RegExpExecArray | null;
    if (req.method === 'POST' && path === '/v1/checkout/sessions') result = createSession(params);
    else if (req.method === 'GET' && (m = /^\/v1\/checkout\/sessions\/([\w-]+)$/.exec(path))) {
      const s = sessions.get(m[1]);
      result = s
        ? { status: 200, body: publicSession(s) }
        : {
            status: 404,
            body: { error: { type: 'invalid_request_error', code: 'resource_missing', message: `The practice server has no checkout.session '${m[1]}'.` } },
          };
    } else if (req.method === 'POST' && (m = /^\/v1\/checkout\/sessions\/([\w-]+)\/expire$/.exec(path))) {
      const s = sessions.get(m[1]);
      if (!s)
        result = {
          status: 404,
          body: { error: { type: 'invalid_request_error', code: 'resource_missing', message: `The practice server has no checkout.session '${m[1]}'.` } },
        };
      else if (s.status !== 'open')
        result = {
          status: 400,
          body: {
            error: {
              type: 'invalid_request_error',
              message: `Only an open checkout session can be closed early; this one is ${s.status}.`,
            },
          },
        };
      else {
        expire(s.id);
        result = { status: 200, body: publicSession(s) };
      }
    } else if (req.method === 'POST' && path === '/v1/refunds') result = createRefund(params);
    else if (req.method === 'GET' && (m = /^\/v1\/refunds\/([\w-]+)$/.exec(path))) {
      const r = refunds.get(m[1]);
      result = r
        ? { status: 200, body: r }
        : {
            status: 404,
            body: { error: { type: 'invalid_request_error', code: 'resource_missing', message: `The practice server has no refund '${m[1]}'.` } },
          };
    } else if (req.method === 'GET' && (m = /^\/v1\/payment_intents\/([\w-]+)$/.exec(path))) {
      const p = intents.get(m[1]);
      result = p
        ? {
            status: 200,
            body: {
              id: p.id,
              object: 'payment_intent',
              amount: p.amount,
              amount_received: p.amount,
              currency: p.currency,
              status: 'succeeded',
              latest_charge: null,
            },
          }
        : {
            status: 404,
            body: { error: { type: 'invalid_request_error', code: 'resource_missing', message: `The practice server has no payment_intent '${m[1]}'.` } },
          };
    }
    if (!result) return stripeError(res, 404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${path}).`);
    if (idemKey && result.status < 500) idempotent.set(idemKey, result);
    send(res, result.status, result.body);
  }

  async function page(req: http.IncomingMessage, res: http.ServerResponse, sessionId: string) {
    const s = sessions.get(sessionId);
    const html = (body: string, status = 200) => {
      res.writeHead(status, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' });
      res.end(body);
    };
    if (!s)
      return html(
        '<!doctype html><html lang="en"><head><title>No such practice payment · Brinewright</title></head><body><main><h1>There is no practice payment at this address</h1></main></body></html>',
        404,
      );
    if (req.method === 'GET') return html(checkoutPage(s));
    const values = Object.fromEntries(new URLSearchParams(await readBody(req))) as Record<string, string>;
    const invalid = s.status === 'open' ? cardCheck(values) : null;
    if (invalid) return html(checkoutPage(s, { error: invalid, values }), 422);
    const result = pay(s.id, values.card ?? '');
    if (!result.ok) return html(checkoutPage(s, { error: result.error, values: { ...values, card: '' } }), 402);
    res.writeHead(303, { location: result.redirect ?? '/' });
    res.end();
  }

  async function control(req: http.IncomingMessage, res: http.ServerResponse, path: string) {
    let m: RegExpExecArray | null;
    if (path === '/_fake/health') return send(res, 200, { ok: true });
    if (req.method === 'POST' && path === '/_fake/webhooks/pause') {
      paused = true;
      return send(res, 200, { paused });
    }
    if (req.method === 'POST' && path === '/_fake/webhooks/resume') {
      paused = false;
      for (const d of held.splice(0)) later(() => void attempt(d), 0);
      return send(res, 200, { paused });
    }
    if (req.method === 'GET' && path === '/_fake/events') return send(res, 200, { deliveries: deliveries.map(({ payload: _p, ...d }) => d) });
    if (req.method === 'POST' && (m = /^\/_fake\/checkout\/([\w-]+)\/pay$/.exec(path))) {
      const body = JSON.parse((await readBody(req)) || '{}') as { card?: string };
      const result = pay(m[1], body.card ?? '');
      return send(res, result.ok ? 200 : 402, result);
    }
    if (req.method === 'POST' && (m = /^\/_fake\/checkout\/([\w-]+)\/expire$/.exec(path))) return send(res, expire(m[1]) ? 200 : 409, { ok: true });
    if (req.method === 'POST' && (m = /^\/_fake\/events\/([\w-]+)\/redeliver$/.exec(path))) {
      await redeliver(m[1]);
      return send(res, 200, { ok: true });
    }
    send(res, 404, { error: 'unknown control path' });
  }

  async function redeliver(eventId: string) {
    const original = deliveries.find((d) => d.eventId === eventId);
    if (!original) throw new Error(`no event ${eventId}`);
    const copy: Delivery = { ...original, attempts: 0, delivered: false, lastStatus: null, lastError: null };
    deliveries.push(copy);
    await attempt(copy);
  }

  const server = http.createServer((req, res) => {
    const path = new URL(req.url ?? '/', 'http://fake').pathname;
    const handler = path.startsWith('/v1/')
      ? api(req, res, path)
      : path.startsWith('/pay/')
        ? page(req, res, path.slice(5))
        : path.startsWith('/_fake/')
          ? control(req, res, path)
          : null;
    if (!handler) {
      res.writeHead(404, { 'content-type': 'text/plain' });
      res.end('Brinewright practice payment server: nothing at this address.');
      return;
    }
    handler.catch((error) => {
      log(`error: ${error instanceof Error ? error.stack : error}`);
      if (!res.headersSent) stripeError(res, 500, 'api_error', 'The practice payment server broke while answering; see its log.');
    });
  });

  // Sessions past their expiry are expired, as the hosted service does.
  const sweep = setInterval(() => {
    for (const s of sessions.values()) if (s.status === 'open' && s.expires_at <= now()) expire(s.id);
  }, options.sweepMs ?? 1000);
  sweep.unref();

  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, options.host ?? '127.0.0.1', () => {
      const { port } = server.address() as AddressInfo;
      baseUrl = `http://${options.host ?? '127.0.0.1'}:${port}`;
      resolve({
        url: baseUrl,
        port,
        sessions,
        refunds,
        deliveries,
        pay,
        expire,
        redeliver,
        setWebhookUrl: (url) => {
          webhookUrl = url;
        },
        async settle(timeoutMs = 10_000) {
          const until = Date.now() + timeoutMs;
          while (deliveries.some((d) => d.inFlight || d.nextAt !== null) && Date.now() < until) await new Promise((r) => setTimeout(r, 20));
        },
        close: () =>
          new Promise<void>((done) => {
            closed = true;
            clearInterval(sweep);
            for (const t of timers) clearTimeout(t);
            server.closeAllConnections?.();
            server.close(() => done());
          }),
      });
    });
  });
}
