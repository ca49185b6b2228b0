import type { Metadata } from 'next';
import type { ReactNode } from 'react';
import '@fontsource/merriweather/400.css';
import '@fontsource/merriweather/700.css';
import './globals.css';
import { Providers } from '@/components/providers';
import { SiteFooter } from '@/components/site-footer';
import { SiteHeader } from '@/components/site-header';

// Public (prerendered) pages are fresh for 5 minutes at the proxy or a CDN (Cache-Control s-maxage=300),
// so a lesson turned members-only does not stay public there for long; per-request pages stay private.
export const revalidate = 300;

export const metadata: Metadata = {
  title: { default: 'Brinewright', template: '%s · Brinewright' },
  description: 'Learn to pickle and can safely: lessons with working calculators, quizzes, workshops and certificates for home canners.',
  manifest: '/manifest.webmanifest',
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en">
      <body>
        <Providers>
          <SiteHeader />
          <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-8">
            {children}
          </main>
          <SiteFooter />
        </Providers>
      </body>
    </html>
  );
}
