import type { ReactNode } from 'react';

/** A titled group of the feed form's fields, laid out in a grid. */
export function FormGroup({
  legend,
  children,
  columns = 'sm:grid-cols-2',
}: {
  legend: string;
  children: ReactNode;
  /** The grid's columns, as Tailwind classes. */
  columns?: string;
}) {
  return (
    <fieldset className={`grid gap-4 border-t border-rule pt-4 ${columns}`}>
      <legend className="pr-2 text-xs font-semibold tracking-[0.12em] text-copper-deep uppercase">
        {legend}
      </legend>
      {children}
    </fieldset>
  );
}
