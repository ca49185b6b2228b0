// nginx as the reverse proxy in front of one or several app servers: finds (or installs) Debian's
// nginx and renders scripts/cluster/nginx.conf for a folder, a port and the app servers' addresses.
// Used by scripts/demo.sh and scripts/demo-cluster.sh (as a command) and by the browser tests of the
// client address and the cluster (as a module).
//   tsx scripts/cluster/nginx.ts DIR PORT 127.0.0.1:3001 [127.0.0.1:3002 ...]   → writes DIR/nginx.conf, prints "NGINX CONF"
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';

const TEMPLATE = path.join(__dirname, 'nginx.conf');

/** The nginx binary, installing Debian's package when it is missing (needs root, like the other one-time installs). */
export function ensureNginx(log: (line: string) => void = (line) => console.error(line)): string {
  const found = ['/usr/sbin/nginx', '/usr/bin/nginx'].find((p) => fs.existsSync(p));
  if (found) return found;
  log("[cluster] nginx is missing: installing Debian's nginx package");
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', 'nginx'], { stdio: 'inherit', env });
  return '/usr/sbin/nginx';
}

export type NginxSetup = { dir: string; port: number; upstreams: string[] };

export function renderNginxConfig({ dir, port, upstreams }: NginxSetup, template = fs.readFileSync(TEMPLATE, 'utf8')): string {
  if (upstreams.length === 0) throw new Error('nginx needs at least one app server');
  for (const u of upstreams) if (!/^127\.0\.0\.1:\d{1,5}$/.test(u)) throw new Error(`App servers listen on 127.0.0.1 only: ${u}`);
  const values: Record<string, string> = {
    // Debian's nginx workers switch to www-data unless told otherwise; as root keep them root so
    // they can write the temporary folders inside the project.
    USER: process.getuid?.() === 0 ? 'user root;' : '',
    DIR: path.resolve(dir),
    PORT: String(port),
    SERVERS: upstreams.map((u) => `    server ${u} max_fails=1 fail_timeout=10s;`).join('\n'),
  };
  const out = template.replace(/@@([A-Z]+)@@/g, (_, name: string) => {
    if (!(name in values)) throw new Error(`Unknown token @@${name}@@ in the nginx template`);
    return values[name];
  });
  return out;
}

/** Writes DIR/nginx.conf (and the folders it names) and returns its path. */
export function writeNginxConfig(setup: NginxSetup): string {
  fs.mkdirSync(setup.dir, { recursive: true });
  const conf = path.join(setup.dir, 'nginx.conf');
  fs.writeFileSync(conf, renderNginxConfig(setup));
  return conf;
}

/** A port free on 127.0.0.1 right now (listen on 0, read it, close). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(__filename)) {
  const [dir, port, ...upstreams] = process.argv.slice(2);
  if (!dir || !/^\d+$/.test(port ?? '') || upstreams.length === 0) {
    console.error('usage: tsx scripts/cluster/nginx.ts DIR PORT 127.0.0.1:PORT_A [127.0.0.1:PORT_B ...]');
    process.exit(2);
  }
  const nginx = ensureNginx();
  const conf = writeNginxConfig({ dir, port: Number(port), upstreams });
  console.log(`${nginx} ${conf}`);
}
