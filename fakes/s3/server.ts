// A local stand-in for an S3-compatible object store, enough for the photo store and its tests:
// path-style CreateBucket, HeadBucket, PutObject, GetObject, HeadObject and DeleteObject, objects
// kept as files under a folder (by default .data/fake-s3). Every request must carry a valid AWS
// Signature Version 4 made with the configured access key and secret (the signature is recomputed
// here, as the real service does), so a wrong key or secret fails against the fake as it would in
// production.
import { createHash, createHmac, timingSafeEqual } from 'node:crypto';
import { promises as fs } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';

export type FakeS3Options = {
  port?: number;
  host?: string;
  /** Folder holding one sub-folder per bucket. */
  root: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** Buckets made at start (the demo and the tests make theirs this way or with CreateBucket). */
  buckets?: string[];
  log?: (line: string) => void;
};

export type FakeS3 = {
  url: string;
  port: number;
  /** Signed requests answered, by operation (e.g. { PutObject: 2 }), and refused signatures. */
  counts: Record<string, number>;
  close(): Promise<void>;
};

const BUCKET = /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/;
const KEY_SEGMENT = /^[A-Za-z0-9!_.*'()-]+$/;
const MAX_SKEW_MS = 15 * 60 * 1000; // S3 refuses requests signed more than 15 minutes away from its clock.
const MAX_BODY = 64 * 1024 * 1024;

const sha256 = (data: string | Buffer) => createHash('sha256').update(data).digest('hex');
const hmac = (key: string | Buffer, data: string) => createHmac('sha256', key).update(data).digest();
// RFC 3986 encoding as SigV4 wants it for query strings.
const rfc3986 = (s: string) => encodeURIComponent(s).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
const xmlEscape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!);

class S3Error extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

/** Checks an AWS SigV4 Authorization header against the request; throws S3Error when it does not hold. */
export function verifySignature(
  request: { method: string; rawPath: string; query: URLSearchParams; headers: http.IncomingHttpHeaders; body: Buffer },
  credentials: { accessKeyId: string; secretAccessKey: string },
  now = Date.now(),
): void {
  const authorization = String(request.headers.authorization ?? '');
  const match =
    /^AWS4-HMAC-SHA256 Credential=([^/\s,]+)\/(\d{8})\/([^/\s,]+)\/s3\/aws4_request,\s*SignedHeaders=([a-z0-9;-]+),\s*Signature=([0-9a-f]{64})$/.exec(
      authorization,
    );
  if (!match) throw new S3Error(403, 'AccessDenied', 'Requests must be signed with AWS Signature Version 4.');
  const [, accessKeyId, day, region, signedHeaderList, signature] = match;
  if (accessKeyId !== credentials.accessKeyId) throw new S3Error(403, 'InvalidAccessKeyId', 'The access key id you provided does not exist in our records.');
  const amzDate = String(request.headers['x-amz-date'] ?? '');
  const dated = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(amzDate);
  if (!dated || !amzDate.startsWith(day)) throw new S3Error(403, 'AccessDenied', 'x-amz-date is missing or does not match the credential scope.');
  const signedAt = Date.UTC(+dated[1], +dated[2] - 1, +dated[3], +dated[4], +dated[5], +dated[6]);
  if (Math.abs(now - signedAt) > MAX_SKEW_MS)
    throw new S3Error(403, 'RequestTimeTooSkewed', 'The difference between the request time and the current time is too large.');

  const signedHeaders = signedHeaderList.split(';');
  if (!signedHeaders.includes('host') || !signedHeaders.includes('x-amz-date')) throw new S3Error(403, 'AccessDenied', 'host and x-amz-date must be signed.');
  const payloadHash = String(request.headers['x-amz-content-sha256'] ?? '');
  if (payloadHash !== 'UNSIGNED-PAYLOAD') {
    if (!/^[0-9a-f]{64}$/.test(payloadHash))
      throw new S3Error(400, 'InvalidArgument', 'x-amz-content-sha256 must be the hex SHA-256 of the body or UNSIGNED-PAYLOAD.');
    if (payloadHash !== sha256(request.body)) throw new S3Error(400, 'XAmzContentSHA256Mismatch', 'The body does not match x-amz-content-sha256.');
  }
  const canonicalHeaders = signedHeaders
    .map((name) => {
      const value = request.headers[name];
      if (value === undefined) throw new S3Error(403, 'AccessDenied', `Signed header ${name} is missing.`);
      return `${name}:${(Array.isArray(value) ? value.join(',') : value).trim().replace(/\s+/g, ' ')}\n`;
    })
    .join('');
  const canonicalQuery = [...request.query.entries()]
    .map(([k, v]) => [rfc3986(k), rfc3986(v)])
    .sort(([a, x], [b, y]) => (a < b ? -1 : a > b ? 1 : x < y ? -1 : x > y ? 1 : 0))
    .map(([k, v]) => `${k}=${v}`)
    .join('&');
  // S3 signs the path as sent (it is not encoded twice, unlike other services).
  const canonicalRequest = [request.method, request.rawPath, canonicalQuery, canonicalHeaders, signedHeaderList, payloadHash].join('\n');
  const scope = `${day}/${region}/s3/aws4_request`;
  const stringToSign = ['AWS4-HMAC-SHA256', amzDate, scope, sha256(canonicalRequest)].join('\n');
  const key = hmac(hmac(hmac(hmac(`AWS4${credentials.secretAccessKey}`, day), region), 's3'), 'aws4_request');
  const expected = createHmac('sha256', key).update(stringToSign).digest();
  if (!timingSafeEqual(expected, Buffer.from(signature, 'hex'))) {
    throw new S3Error(
      403,
      'SignatureDoesNotMatch',
      'The request signature we calculated does not match the signature you provided. Check your key and signing method.',
    );
  }
}

type Meta = { contentType: string; etag: string; size: number; lastModified: string };

export async function startFakeS3(options: FakeS3Options): Promise<FakeS3> {
  const host = options.host ?? '127.0.0.1';
  const log = options.log ?? (() => {});
  const root = path.resolve(options.root);
  const counts: Record<string, number> = {};
  const count = (name: string) => {
    counts[name] = (counts[name] ?? 0) + 1;
  };
  await fs.mkdir(root, { recursive: true });
  for (const bucket of options.buckets ?? []) await fs.mkdir(path.join(root, bucket, 'objects'), { recursive: true });

  const bucketDir = (bucket: string) => path.join(root, bucket);
  const objectFile = (bucket: string, key: string) => path.join(root, bucket, 'objects', ...key.split('/'));
  const metaFile = (bucket: string, key: string) => path.join(root, bucket, 'meta', `${key.split('/').join('%2F')}.json`);
  const exists = (file: string) =>
    fs.stat(file).then(
      () => true,
      () => false,
    );
  const requireBucket = async (bucket: string) => {
    if (!(await exists(bucketDir(bucket)))) throw new S3Error(404, 'NoSuchBucket', 'The specified bucket does not exist.');
  };
  const readMeta = async (bucket: string, key: string): Promise<Meta> => {
    try {
      return JSON.parse(await fs.readFile(metaFile(bucket, key), 'utf8')) as Meta;
    } catch {
      throw new S3Error(404, 'NoSuchKey', 'The specified key does not exist.');
    }
  };
  const objectHeaders = (meta: Meta) => ({
    'content-type': meta.contentType,
    'content-length': String(meta.size),
    etag: meta.etag,
    'last-modified': new Date(meta.lastModified).toUTCString(),
  });

  async function handle(req: http.IncomingMessage, body: Buffer, res: http.ServerResponse) {
    const url = new URL(req.url ?? '/', 'http://fake-s3');
    const rawPath = (req.url ?? '/').split('?')[0];
    if (rawPath === '/_fake/health') {
      res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify({ ok: true, counts }));
      return;
    }
    const method = req.method ?? 'GET';
    try {
      verifySignature({ method, rawPath, query: url.searchParams, headers: req.headers, body }, options);
    } catch (error) {
      count('refused');
      throw error;
    }
    const [bucket, ...rest] = decodeURIComponent(rawPath).replace(/^\//, '').split('/');
    if (!BUCKET.test(bucket ?? '')) throw new S3Error(400, 'InvalidBucketName', 'The specified bucket is not valid (path-style requests only).');
    const key = rest.join('/');
    if (key === '') {
      if (method === 'PUT') {
        count('CreateBucket');
        if (await exists(bucketDir(bucket)))
          throw new S3Error(409, 'BucketAlreadyOwnedByYou', 'Your previous request to create the named bucket succeeded and you already own it.');
        await fs.mkdir(path.join(bucketDir(bucket), 'objects'), { recursive: true });
        res.writeHead(200, { location: `/${bucket}` }).end();
        return;
      }
      if (method === 'HEAD') {
        count('HeadBucket');
        await requireBucket(bucket);
        res.writeHead(200).end();
        return;
      }
      throw new S3Error(501, 'NotImplemented', `${method} on a bucket is not part of this fake.`);
    }
    if (!rest.every((segment) => KEY_SEGMENT.test(segment)) || rest.some((s) => s === '.' || s === '..') || key.length > 1024) {
      throw new S3Error(400, 'InvalidArgument', "This fake accepts keys of letters, digits, / and !_.*'()- only.");
    }
    await requireBucket(bucket);
    if (method === 'PUT') {
      count('PutObject');
      if (req.headers['x-amz-copy-source']) throw new S3Error(501, 'NotImplemented', 'CopyObject is not part of this fake.');
      const file = objectFile(bucket, key);
      const meta: Meta = {
        contentType: String(req.headers['content-type'] ?? 'binary/octet-stream'),
        etag: `"${createHash('md5').update(body).digest('hex')}"`,
        size: body.length,
        lastModified: new Date().toISOString(),
      };
      await fs.mkdir(path.dirname(file), { recursive: true });
      await fs.mkdir(path.dirname(metaFile(bucket, key)), { recursive: true });
      // Data first, then its metadata, each written whole: a reader sees the old object or the new one.
      const temporary = `${file}.${process.pid}.${Date.now()}.part`;
      await fs.writeFile(temporary, body);
      await fs.rename(temporary, file);
      await fs.writeFile(`${metaFile(bucket, key)}.part`, JSON.stringify(meta));
      await fs.rename(`${metaFile(bucket, key)}.part`, metaFile(bucket, key));
      res.writeHead(200, { etag: meta.etag }).end();
      return;
    }
    if (method === 'GET' || method === 'HEAD') {
      count(method === 'GET' ? 'GetObject' : 'HeadObject');
      const meta = await readMeta(bucket, key);
      if (method === 'HEAD') {
        res.writeHead(200, objectHeaders(meta)).end();
        return;
      }
      const data = await fs.readFile(objectFile(bucket, key)).catch(() => {
        throw new S3Error(404, 'NoSuchKey', 'The specified key does not exist.');
      });
      res.writeHead(200, objectHeaders(meta)).end(data);
      return;
    }
    if (method === 'DELETE') {
      count('DeleteObject');
      // S3 answers 204 whether or not the key existed.
      await fs.rm(metaFile(bucket, key), { force: true });
      await fs.rm(objectFile(bucket, key), { force: true });
      res.writeHead(204).end();
      return;
    }
    throw new S3Error(501, 'NotImplemented', `${method} is not part of this fake.`);
  }

  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size <= MAX_BODY) chunks.push(chunk);
    });
    req.on('end', () => {
      const fail = (error: unknown) => {
        const e = error instanceof S3Error ? error : new S3Error(500, 'InternalError', 'We encountered an internal error. Please try again.');
        if (!(error instanceof S3Error)) log(`internal error: ${(error as Error).stack ?? error}`);
        // A missing key is an ordinary answer (the app asks before it knows); refusals and faults are logged.
        else if (e.status !== 404) log(`${req.method} ${req.url} → ${e.status} ${e.code}`);
        const xml = `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>${e.code}</Code><Message>${xmlEscape(e.message)}</Message><Resource>${xmlEscape(req.url ?? '')}</Resource></Error>`;
        if (res.headersSent) return res.destroy();
        // HEAD answers carry no body; the SDK reads the status alone.
        res.writeHead(e.status, { 'content-type': 'application/xml' }).end(req.method === 'HEAD' ? undefined : xml);
      };
      if (size > MAX_BODY) return fail(new S3Error(400, 'EntityTooLarge', 'Your proposed upload exceeds the maximum allowed size of this fake.'));
      handle(req, Buffer.concat(chunks), res).catch(fail);
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, host, () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  const url = `http://${host}:${port}`;
  log(`listening on ${url}, objects under ${root}`);
  return {
    url,
    port,
    counts,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
