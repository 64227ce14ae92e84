import { Link, useLocation } from 'react-router-dom';

export function NotFoundPage() {
  const { pathname } = useLocation();
  return (
    <div className="max-w-xl">
      <p className="font-mono text-sm text-ink-soft">404</p>
      <h1 className="mt-2 text-3xl font-semibold">Nothing lives at this address</h1>
      <p className="mt-3 text-ink-soft">
        There is no page at <code className="font-mono">{pathname}</code>. It may have moved, or the
        link may be mistyped.
      </p>
      <Link to="/" className="mt-6 inline-block underline">
        Back to the start page
      </Link>
    </div>
  );
}
