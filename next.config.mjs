import { membersLessonRoutes } from './lib/content/members-lesson-routes.mjs';

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

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize and its driver load modules dynamically; the bundler must leave them to Node.
  serverExternalPackages: ['sequelize', 'mariadb', 'sharp', 'pdf-lib', 'nodemailer'],
  // Lets a second build (tests, a helper's branch of work) live beside the demo's.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  // With the layout's revalidate (300 s): Cache-Control s-maxage=300, stale-while-revalidate=300 on public pages.
  expireTime: 600,
  // Lessons share one address, /learn/<course>/<lesson>. The public preview lessons are the only
  // params app/learn/[course]/[lesson] prerenders (dynamicParams = false, so unknown lessons answer
  // 404 there). Every members-only lesson is rewritten, without changing the address, to
  // app/learn/[course]/[lesson]/members, which checks the session and the enrollment and renders per
  // request. The rewrite is an afterFiles one, listed lesson by lesson from the front matter: it is
  // decided before the dynamic [lesson] route, so the router's own (RSC) requests reach the members
  // page too. (A fallback rewrite reached it only for HTML: Next 16.4 first matched the prerendered
  // route's 404 for the router's requests and failed them with a 500, "Expected RSC response".)
  // A rewrite in the router costs far less than running a proxy (middleware) on every lesson request.
  async rewrites() {
    return {
      afterFiles: membersLessonRoutes().map(({ course, lessons }) => ({
        source: `/learn/${course}/:lesson(${lessons.join('|')})`,
        destination: `/learn/${course}/:lesson/members`,
      })),
    };
  },
  experimental: {
    authInterrupts: true,
  },
  async headers() {
    return [
      { source: '/:path*', headers: securityHeaders },
      { source: '/:path*', has: [{ type: 'header', key: 'x-forwarded-proto', value: 'https' }], headers: httpsOnlyHeaders },
    ];
  },
};

export default nextConfig;
