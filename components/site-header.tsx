import Link from 'next/link';
import { Logo } from '@/components/logo';
import { LinkPending } from '@/components/ui/link-pending';
import { PUBLIC_NAV } from '@/lib/nav';
import { ProgramBadge } from './program/program-badge';
import { HeaderMenu } from './header-menu';
import { UserNav } from './user-nav';

/** Static header; the signed-in part is a client leaf so public pages stay static. */
export function SiteHeader() {
  return (
    <header data-site-header className="bg-brine-800 text-white">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:rounded focus:bg-white focus:px-3 focus:py-1 focus:text-brine-900"
      >
        Skip to content
      </a>
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href="/" className="no-underline" aria-label="Brinewright home">
          <Logo />
        </Link>
        <ProgramBadge />
        <HeaderMenu>
          <nav aria-label="Main" className="flex flex-col gap-2 md:flex-1 md:flex-row md:flex-wrap md:items-center md:gap-x-4 md:gap-y-1">
            {PUBLIC_NAV.map((item) => (
              <Link key={item.href} href={item.href} className="relative text-sm font-medium text-brine-50 no-underline hover:text-white hover:underline">
                {item.label}
                <LinkPending />
              </Link>
            ))}
          </nav>
          <UserNav />
        </HeaderMenu>
      </div>
    </header>
  );
}
