import { createHash } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { verifySignature } from '../../fakes/s3/server';

// The fake's SigV4 check, held against requests the AWS SDK itself signed (the reference signer):
// a captured request passes, and any change to what was signed is refused.
const credentials = { accessKeyId: 'BRINEWRIGHTSIGKEY001', secretAccessKey: 'signature-test-secret-0123456789abcdef' };
type Captured = { method: string; rawPath: string; query: URLSearchParams; headers: http.IncomingHttpHeaders; body: Buffer };

let captured: Captured;
let server: http.Server;

beforeAll(async () => {
  server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      const url = req.url ?? '/';
      captured = {
        method: req.method ?? 'GET',
        rawPath: url.split('?')[0],
        query: new URL(url, 'http://x').searchParams,
        headers: req.headers,
        body: Buffer.concat(chunks),
      };
      res.writeHead(200, { etag: '"0"' }).end();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const client = new S3Client({
    region: 'eu-north-1',
    endpoint: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    forcePathStyle: true,
    credentials,
    requestChecksumCalculation: 'WHEN_REQUIRED',
  });
  await client.send(
    new PutObjectCommand({ Bucket: 'brinewright-sig', Key: 'photos/1/signed.jpg', Body: Buffer.from('jar photo bytes'), ContentType: 'image/jpeg' }),
  );
  client.destroy();
});
afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

const copy = (c: Captured): Captured => ({ ...c, headers: { ...c.headers }, query: new URLSearchParams(c.query) });

describe('verifySignature (fakes/s3)', () => {
  it('accepts the request as the SDK signed it', () => {
    expect(captured.headers.authorization).toMatch(/^AWS4-HMAC-SHA256 Credential=BRINEWRIGHTSIGKEY001\/\d{8}\/eu-north-1\/s3\/aws4_request/);
    expect(() => verifySignature(captured, credentials)).not.toThrow();
  });

  it('refuses a wrong secret or an unknown key id', () => {
    expect(() => verifySignature(captured, { ...credentials, secretAccessKey: 'another-secret-entirely-000000' })).toThrow(
      /signature we calculated does not match/,
    );
    expect(() => verifySignature(captured, { ...credentials, accessKeyId: 'SOMEONEELSE000000000' })).toThrow(/access key id you provided does not exist/);
  });

  it('refuses a changed body, a changed signed header, another path or an added query parameter', () => {
    expect(() => verifySignature({ ...copy(captured), body: Buffer.from('jar photo bytez') }, credentials)).toThrow(/body does not match/);
    // A new body with its own correct hash: the hash header is signed, so the signature breaks.
    const swapped = copy(captured);
    swapped.body = Buffer.from('other bytes');
    swapped.headers['x-amz-content-sha256'] = createHash('sha256').update(swapped.body).digest('hex');
    expect(String(captured.headers.authorization)).toMatch(/SignedHeaders=[^,]*x-amz-content-sha256/);
    expect(() => verifySignature(swapped, credentials)).toThrow(/signature we calculated does not match/);
    const host = copy(captured);
    host.headers.host = '127.0.0.1:1';
    expect(() => verifySignature(host, credentials)).toThrow(/does not match/);
    expect(() => verifySignature({ ...copy(captured), rawPath: '/brinewright-sig/photos/1/other.jpg' }, credentials)).toThrow(/does not match/);
    const query = copy(captured);
    query.query.set('acl', '');
    expect(() => verifySignature(query, credentials)).toThrow(/does not match/);
  });

  it('refuses a request signed more than 15 minutes away from its clock, and an unsigned one', () => {
    const signedAt = Date.parse(String(captured.headers['x-amz-date']).replace(/^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/, '$1-$2-$3T$4:$5:$6Z'));
    expect(() => verifySignature(captured, credentials, signedAt + 14 * 60_000)).not.toThrow();
    expect(() => verifySignature(captured, credentials, signedAt + 16 * 60_000)).toThrow(/too large/);
    const unsigned = copy(captured);
    delete unsigned.headers.authorization;
    expect(() => verifySignature(unsigned, credentials)).toThrow(/Signature Version 4/);
  });
});
