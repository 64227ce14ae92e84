import type { ReactNode } from 'react';

/** A titled part of a page, with optional actions beside the title. */
export function Section({
  title,
  id,
  actions,
  children,
}: {
  title: string;
  id: string;
  actions?: ReactNode;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={id} className="mt-8">
      <div className="flex items-baseline justify-between gap-4 border-b border-rule pb-1">
        <h2 id={id} className="text-lg font-semibold">
          {title}
        </h2>
        {actions}
      </div>
      <div className="mt-3">{children}</div>
    </section>
  );
}
