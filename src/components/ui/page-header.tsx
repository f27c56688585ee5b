import type { ReactNode } from 'react';

export function PageHeader({
  title,
  kicker,
  actions,
  children,
}: {
  title: string;
  kicker?: ReactNode;
  actions?: ReactNode;
  children?: ReactNode;
}) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-rule pb-4">
      <div>
        {kicker ? (
          <p className="mb-1 text-xs font-semibold uppercase tracking-[0.14em] text-copper-deep">
            {kicker}
          </p>
        ) : null}
        <h1 className="text-2xl font-semibold text-ink">{title}</h1>
        {children ? <div className="mt-1 text-ink-soft">{children}</div> : null}
      </div>
      {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
    </header>
  );
}
