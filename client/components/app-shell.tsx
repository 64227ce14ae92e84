import { Link, Outlet } from 'react-router-dom';
import { ServiceStatus } from './service-status.tsx';

/** The frame of every page: product name, navigation, and the service status in the footer. */
export function AppShell() {
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-paper focus:p-2"
      >
        Skip to content
      </a>
      <header className="border-b border-rule">
        <div className="mx-auto flex max-w-6xl items-baseline justify-between px-6 py-4">
          <Link
            to="/"
            className="text-xl font-semibold tracking-tight text-ink"
            data-testid="product-name"
          >
            Stablehand
          </Link>
          <span className="text-sm text-ink-soft">review service for factorisation kernels</span>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-6 py-10">
        <Outlet />
      </main>
      <footer className="border-t border-rule">
        <div className="mx-auto flex max-w-6xl justify-between px-6 py-3 text-xs text-ink-soft">
          <span>Evidence for reviewers, not certification.</span>
          <ServiceStatus />
        </div>
      </footer>
    </div>
  );
}
