import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { renderNginxConfig } from '../../scripts/cluster/nginx';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-nginx-conf-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

/** The directives alone (comments dropped). */
const directives = (conf: string) =>
  conf
    .split('\n')
    .filter((line) => !line.trim().startsWith('#'))
    .join('\n');

// nginx itself checks the rendered file in tests/e2e/client-address.test.ts (nginx -t), outside the unit tier.
describe('the reverse proxy configuration (scripts/cluster/nginx.conf)', () => {
  const setup = { dir, port: 3999, upstreams: ['127.0.0.1:4001', '127.0.0.1:4002'] };

  it('lists every app server in one upstream, listens on loopback and keeps its files in its own folder', () => {
    const conf = directives(renderNginxConfig(setup));
    expect(conf).not.toMatch(/@@/);
    expect(conf).toContain('server 127.0.0.1:4001 max_fails=1 fail_timeout=10s;');
    expect(conf).toContain('server 127.0.0.1:4002 max_fails=1 fail_timeout=10s;');
    expect(conf).toContain('listen 127.0.0.1:3999;');
    expect(conf).toContain('daemon off;');
    for (const file of ['nginx.pid', 'error.log', 'access.log', 'tmp-body', 'tmp-proxy']) expect(conf).toContain(`${path.resolve(dir)}/${file}`);
  });

  it('passes the client address, host and scheme on, retries a failed server but never repeats a POST', () => {
    const conf = directives(renderNginxConfig(setup));
    expect(conf).toContain('proxy_set_header X-Forwarded-For $remote_addr;');
    expect(conf).toContain('proxy_set_header Host $http_host;');
    expect(conf).toContain('proxy_set_header X-Forwarded-Proto $scheme;');
    expect(conf).toMatch(/proxy_next_upstream error timeout http_502 http_504;/);
    expect(conf).not.toMatch(/non_idempotent/);
  });

  it('refuses app servers off the loopback address and unknown tokens', () => {
    expect(() => renderNginxConfig({ ...setup, upstreams: ['0.0.0.0:4001'] })).toThrow(/127\.0\.0\.1 only/);
    expect(() => renderNginxConfig({ ...setup, upstreams: [] })).toThrow(/at least one/);
    expect(() => renderNginxConfig(setup, 'listen @@PORT@@; @@OTHER@@')).toThrow(/@@OTHER@@/);
  });
});
