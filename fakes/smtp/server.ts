// A local stand-in for an SMTP relay: it accepts every message, parses it with mailparser, keeps it
// in memory and shows the mailbox on a small web page (and as JSON for the tests).
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export type StoredMessage = {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  headers: Record<string, string>;
  attachments: { filename: string | null; contentType: string; size: number }[];
};

export type FakeSmtpOptions = { smtpPort?: number; webPort?: number; host?: string; log?: (line: string) => void };

export type FakeSmtp = {
  smtpPort: number;
  webUrl: string;
  messages: StoredMessage[];
  /** Stops accepting SMTP connections (the web page stays up), as if the relay were down. */
  stopSmtp(): Promise<void>;
  /** Listens again on the same SMTP port. */
  startSmtp(): Promise<void>;
  /** Resolves when at least `count` messages have arrived (or rejects after timeoutMs). */
  waitFor(count: number, timeoutMs?: number): Promise<StoredMessage[]>;
  close(): Promise<void>;
};

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
const addresses = (a: AddressObject | AddressObject[] | undefined) =>
  a ? (Array.isArray(a) ? a : [a]).flatMap((x) => x.value.map((v) => v.address ?? '')) : [];

function layout(title: string, body: string) {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${esc(title)}</title>
<style>body{font-family:system-ui,sans-serif;margin:0;padding:1.5rem;background:#f7f7f5;color:#1f2933}main{max-width:60rem;margin:0 auto}
table{border-collapse:collapse;width:100%;background:#fff}th,td{border-bottom:1px solid #d1d5db;padding:.5rem;text-align:left;vertical-align:top}
a{color:#1e40af}pre{white-space:pre-wrap;background:#fff;border:1px solid #d1d5db;padding:1rem}iframe{width:100%;height:32rem;border:1px solid #d1d5db;background:#fff}</style></head>
<body><main>${body}</main></body></html>`;
}

export async function startFakeSmtp(options: FakeSmtpOptions = {}): Promise<FakeSmtp> {
  const host = options.host ?? '127.0.0.1';
  const log = options.log ?? (() => {});
  const messages: StoredMessage[] = [];
  const waiters = new Set<() => void>();
  let nextId = 1;
  let smtpPort = options.smtpPort ?? 0;

  const makeSmtp = () =>
    new SMTPServer({
      secure: false,
      disabledCommands: ['STARTTLS'],
      authOptional: true,
      logger: false,
      banner: 'Brinewright local mail catcher',
      onData(stream, _session, callback) {
        simpleParser(stream)
          .then((mail) => {
            const headers: Record<string, string> = {};
            for (const [k, v] of mail.headers) if (typeof v === 'string') headers[k] = v;
            const stored: StoredMessage = {
              id: nextId++,
              receivedAt: new Date().toISOString(),
              from: addresses(mail.from).join(', '),
              to: addresses(mail.to),
              subject: mail.subject ?? '',
              text: mail.text ?? '',
              html: typeof mail.html === 'string' ? mail.html : null,
              headers,
              attachments: mail.attachments.map((a) => ({ filename: a.filename ?? null, contentType: a.contentType, size: a.size })),
            };
            messages.push(stored);
            log(`message ${stored.id} to ${stored.to.join(', ')}: ${stored.subject}`);
            for (const w of waiters) w();
            callback();
          })
          .catch((error) => callback(error));
      },
    });

  let smtp: SMTPServer | null = null;
  const listenSmtp = () =>
    new Promise<void>((resolve, reject) => {
      const server = makeSmtp();
      server.on('error', (error) => log(`smtp error: ${error.message}`));
      server.server.once('error', reject);
      server.listen(smtpPort, host, () => {
        smtpPort = (server.server.address() as AddressInfo).port;
        smtp = server;
        resolve();
      });
    });
  const closeSmtp = () =>
    new Promise<void>((resolve) => {
      if (!smtp) return resolve();
      const s = smtp;
      smtp = null;
      s.close(() => resolve());
    });

  const web = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://mailbox');
    const html = (status: number, body: string) => {
      res.writeHead(status, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' });
      res.end(body);
    };
    if (url.pathname === '/api/messages' && req.method === 'GET') {
      res.writeHead(200, { 'content-type': 'application/json' });
      return res.end(JSON.stringify({ messages }));
    }
    if (url.pathname === '/api/messages' && req.method === 'DELETE') {
      messages.length = 0;
      res.writeHead(204);
      return res.end();
    }
    if (url.pathname === '/') {
      const rows = [...messages]
        .reverse()
        .map(
          (m) =>
            `<tr><td>${esc(new Date(m.receivedAt).toLocaleString('en-US', { timeZone: 'UTC' }))} UTC</td><td>${esc(m.to.join(', '))}</td><td><a href="/messages/${m.id}">${esc(m.subject || '(no subject)')}</a></td></tr>`,
        )
        .join('');
      return html(
        200,
        layout(
          'Local mailbox',
          `<h1>Local mailbox</h1><p>Every message the app sent through the local SMTP server (${messages.length}). Nothing here leaves this computer.</p>
<table><thead><tr><th scope="col">Received</th><th scope="col">To</th><th scope="col">Subject</th></tr></thead><tbody>${rows || '<tr><td colspan="3">No messages yet.</td></tr>'}</tbody></table>`,
        ),
      );
    }
    const m = /^\/messages\/(\d+)(\/html)?$/.exec(url.pathname);
    const message = m ? messages.find((x) => x.id === Number(m[1])) : undefined;
    if (message && m?.[2]) {
      // The HTML part alone, for the sandboxed frame.
      res.writeHead(200, {
        'content-type': 'text/html; charset=utf-8',
        'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; img-src data:",
      });
      return res.end(message.html ?? '');
    }
    if (message) {
      return html(
        200,
        layout(
          message.subject,
          `<p><a href="/">← All messages</a></p><h1>${esc(message.subject)}</h1>
<p>From ${esc(message.from)} to ${esc(message.to.join(', '))}</p>
${message.attachments.length ? `<p>Attachments: ${message.attachments.map((a) => `${esc(a.filename ?? 'unnamed')} (${esc(a.contentType)}, ${a.size} bytes)`).join('; ')}</p>` : ''}
<h2>Text part</h2><pre>${esc(message.text)}</pre>
${message.html ? `<h2>HTML part</h2><iframe title="HTML part of the message" sandbox src="/messages/${message.id}/html"></iframe>` : ''}`,
        ),
      );
    }
    html(404, layout('Not found', '<h1>Not found</h1><p><a href="/">Back to the mailbox</a></p>'));
  });

  await listenSmtp();
  await new Promise<void>((resolve, reject) => {
    web.once('error', reject);
    web.listen(options.webPort ?? 0, host, () => resolve());
  });
  const webUrl = `http://${host}:${(web.address() as AddressInfo).port}`;

  return {
    get smtpPort() {
      return smtpPort;
    },
    webUrl,
    messages,
    stopSmtp: closeSmtp,
    startSmtp: listenSmtp,
    waitFor(count, timeoutMs = 10_000) {
      return new Promise((resolve, reject) => {
        if (messages.length >= count) return resolve(messages);
        const timer = setTimeout(() => {
          waiters.delete(check);
          reject(new Error(`expected ${count} message(s), have ${messages.length}`));
        }, timeoutMs);
        const check = () => {
          if (messages.length >= count) {
            clearTimeout(timer);
            waiters.delete(check);
            resolve(messages);
          }
        };
        waiters.add(check);
      });
    },
    async close() {
      await closeSmtp();
      web.closeAllConnections?.();
      await new Promise<void>((resolve) => web.close(() => resolve()));
    },
  };
}
