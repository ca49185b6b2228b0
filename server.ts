// The production server (`npm start`): Next's request handler behind node:http, with three things
// `next start` does not do.
//
// - Static pages from memory (lib/server/static-pages.ts): the pages `next build` prerendered once
//   are answered with the status, headers and bytes Next gave for the same kind of request,
//   recorded from Next on the first such request. Everything else goes to Next unchanged.
// - The client's address: unless TRUST_PROXY=true, X-Forwarded-For becomes the connection's own
//   address before Next reads it (lib/server/client-address.ts), so a client reaching the server
//   directly cannot pick its address for the per-address throttles.
// - Several processes: WEB_CONCURRENCY workers (node:cluster, default 1) share the port. Nothing
//   the app keeps in a process may be needed by another: sessions are tokens, throttles and jobs
//   live in MariaDB, photos in the storage driver (the same rule as two servers behind nginx).
//
//   tsx server.ts [--port 3000] [--hostname 127.0.0.1]    (PORT and HOSTNAME work too)
//
// Development keeps `next dev` (npm run dev); this server refuses NODE_ENV=development.
import cluster from 'node:cluster';
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { getEnv } from './lib/env';
import { refuseDemoSettings } from './lib/production-check';
import { applyClientAddress } from './lib/server/client-address';
import { RECORD_HEADER, StaticPageCache, recordable, recordingHeaders, sendRecorded, staticPagePaths, variantFor } from './lib/server/static-pages';

Object.assign(process.env, { NODE_ENV: process.env.NODE_ENV ?? 'production' });
if (process.env.NODE_ENV !== 'production') {
  console.error(`server.ts is the production server (NODE_ENV is ${process.env.NODE_ENV}); use npm run dev for development.`);
  process.exit(2);
}

const { values } = parseArgs({ options: { port: { type: 'string', short: 'p' }, hostname: { type: 'string', short: 'H' } } });
const port = Number(values.port ?? process.env.PORT ?? 3000);
const hostname = values.hostname ?? process.env.HOSTNAME ?? undefined;
if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`server.ts: the port must be a number from 0 to 65535 (got ${values.port ?? process.env.PORT})`);
// The whole configuration is checked here, before any worker starts (lib/env.ts names what is wrong).
const { WEB_CONCURRENCY: workers, TRUST_PROXY: trustProxy } = getEnv();
// Demo secrets and the local payment fake are refused in production (lib/production-check.ts).
try {
  refuseDemoSettings(getEnv(), process.env, 'The app server');
} catch (error) {
  console.error(error instanceof Error ? error.message : String(error));
  process.exit(2);
}

const root = __dirname;
const log = (message: string) => process.stdout.write(`[server${cluster.isWorker ? ` ${cluster.worker?.id}` : ''}] ${message}\n`);

if (workers > 1 && cluster.isPrimary) {
  let stopping = false;
  for (let i = 0; i < workers; i++) cluster.fork();
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) {
      if (!Object.keys(cluster.workers ?? {}).length) process.exit(0);
      return;
    }
    log(`worker ${worker.id} ended (${signal ?? code}); starting another`);
    cluster.fork();
  });
  const stop = () => {
    stopping = true;
    for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill('SIGTERM');
    setTimeout(() => process.exit(0), 10_000).unref();
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
  log(`${workers} workers on ${hostname ?? '*'}:${port}`);
} else {
  void serve();
}

async function serve() {
  // Loaded here so that the primary of several workers never loads Next.
  const { default: next } = await import('next');
  const app = next({ dev: false, dir: root, hostname: hostname ?? 'localhost', port });
  const handle = app.getRequestHandler();
  await app.prepare();

  const { default: nextConfig } = await import('./next.config.mjs');
  const manifestFile = path.join(root, nextConfig.distDir ?? '.next', 'prerender-manifest.json');
  const cache = new StaticPageCache(staticPagePaths(JSON.parse(fs.readFileSync(manifestFile, 'utf8'))));
  let listeningPort = port;
  // Recordings go to this server itself (with several workers, to any of them: the same answer).
  const selfHost = hostname && hostname !== '0.0.0.0' && hostname !== '::' ? hostname : '127.0.0.1';

  const record = (pagePath: string, variant: string) => {
    const request = http.get({ host: selfHost, port: listeningPort, path: pagePath, headers: recordingHeaders(variant), timeout: 10_000 }, (response) => {
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('end', () => cache.finish(pagePath, variant, recordable(response.statusCode ?? 0, response.rawHeaders, Buffer.concat(chunks))));
      response.on('error', () => cache.finish(pagePath, variant, null));
    });
    request.on('timeout', () => request.destroy());
    request.on('error', () => cache.finish(pagePath, variant, null));
  };

  const server = http.createServer((req, res) => {
    applyClientAddress(req.headers, req.socket.remoteAddress, trustProxy);
    const hit = variantFor(req.method, req.url, req.headers, cache.pages);
    if (hit) {
      const page = cache.get(hit.path, hit.variant);
      if (page) return sendRecorded(req, res, page);
      if (cache.shouldRecord(hit.path, hit.variant)) record(hit.path, hit.variant);
    }
    void handle(req, res);
  });
  // Longer than a proxy's idle keep-alive (nginx's upstream keepalive_timeout is 60 s), so that the
  // server never closes a connection the proxy is about to reuse.
  server.keepAliveTimeout = 65_000;
  server.on('error', (error) => {
    // A port in use or refused: end, so that whoever started the server sees it fail.
    console.error(`[server] cannot listen on ${hostname ?? '*'}:${port}: ${error.message}`);
    process.exit(1);
  });
  server.listen(port, hostname, () => {
    const address = server.address();
    if (address && typeof address === 'object') listeningPort = address.port;
    log(`ready on http://${hostname ?? 'localhost'}:${listeningPort} (${cache.pages.size} static pages answered from memory once recorded; ${RECORD_HEADER} requests always reach Next)`);
  });

  const stop = () => {
    server.close();
    void app.close().finally(() => process.exit(0));
    setTimeout(() => process.exit(0), 5_000).unref();
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}
