// `next dev` runs with NODE_ENV=development; `next build` and `next start` with production.
const isDev = process.env.NODE_ENV === 'development';

// One static Content-Security-Policy for every page and route (no per-request nonce, so the public
// pages stay prerendered). Next's inline bootstrap scripts (self.__next_f.push(...)) therefore need
// 'unsafe-inline' in script-src; 'unsafe-eval' only in development, where React's dev tooling needs it.
// React `style` attributes (chart bars, photo zoom) need 'unsafe-inline' in style-src.
const contentSecurityPolicy = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${isDev ? " 'unsafe-eval'" : ''}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  `connect-src 'self'${isDev ? ' ws: wss:' : ''}`,
  "media-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
  "frame-src 'none'",
  "worker-src 'self'",
  "manifest-src 'self'",
].join('; ');

export const securityHeaders = [
  { key: 'Content-Security-Policy', value: contentSecurityPolicy },
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=(), payment=(), usb=()' },
  { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
  { key: 'Cross-Origin-Resource-Policy', value: 'same-origin' },
];

// Browsers ignore Strict-Transport-Security on plain http, and the demo and tests serve plain http
// on 127.0.0.1; behind a TLS-terminating proxy (which sets X-Forwarded-Proto: https) it is sent.
const httpsOnlyHeaders = [{ key: 'Strict-Transport-Security', value: 'max-age=31536000; includeSubDomains' }];

// The lesson route (app/learn/[course]/[lesson]); the practical's page beside it is not a lesson.
const LESSON_PATH = '/learn/:course/:lesson((?!practical$)[^/]+)';
// next-auth's session cookie on http and on https (lib/auth/session.ts reads both).
const SESSION_COOKIES = ['next-auth.session-token', '__Secure-next-auth.session-token', 'next-auth.session-token.0', '__Secure-next-auth.session-token.0'].map(
  (key) => /** @type {const} */ ({ type: 'cookie', key }),
);
// The same as the prerendered public pages' (the root layout's revalidate and expireTime below).
const PUBLIC_PAGE_CACHE = 's-maxage=300, stale-while-revalidate=300';
const PRIVATE_PAGE_CACHE = 'private, no-cache, no-store, max-age=0, must-revalidate';

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize and its driver load modules dynamically; the bundler must leave them to Node.
  serverExternalPackages: ['sequelize', 'mariadb', 'sharp', 'pdf-lib', 'nodemailer'],
  // Lets a second build (tests, a helper's branch of work) live beside the demo's.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  // The browser tests' build leaves the type check to `npm run typecheck` (CI runs it beside the linter).
  typescript: { ignoreBuildErrors: process.env.BRINEWRIGHT_SKIP_TYPECHECK === '1' },
  // With the layout's revalidate (300 s): Cache-Control s-maxage=300, stale-while-revalidate=300 on prerendered public pages.
  expireTime: 600,
  experimental: {
    authInterrupts: true,
    // Turbopack keeps a build cache in the dist folder (on by default): a second build on the same
    // checkout takes about half the CPU. A clean clone (CI) has none to reuse, and writing it costs
    // about 10 s, so .ci/run turns it off with BRINEWRIGHT_BUILD_CACHE=0.
    turbopackFileSystemCacheForBuild: process.env.BRINEWRIGHT_BUILD_CACHE !== '0',
  },
  async headers() {
    return [
      { source: '/:path*', headers: securityHeaders },
      // Lessons render per request. An answer to a request without a session cookie cannot depend on
      // who asked, so the proxy or a CDN may keep it for minutes (a lesson turned members-only leaves
      // them soon); with the cookie it is the reader's own. Next keeps a Cache-Control set here.
      { source: LESSON_PATH, missing: SESSION_COOKIES, headers: [{ key: 'Cache-Control', value: PUBLIC_PAGE_CACHE }] },
      ...SESSION_COOKIES.map((cookie) => ({ source: LESSON_PATH, has: [cookie], headers: [{ key: 'Cache-Control', value: PRIVATE_PAGE_CACHE }] })),
      { source: '/:path*', has: [{ type: 'header', key: 'x-forwarded-proto', value: 'https' }], headers: httpsOnlyHeaders },
    ];
  },
};

export default nextConfig;
