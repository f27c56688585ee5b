import { useId } from 'react';
import { Link } from 'react-router-dom';
import type { Finding } from '#shared/schemas/checks.schema.ts';
import { SeverityLabel } from '@/components/ui/severity.tsx';
import { formatFindingValue, type SubjectLink } from '../lib/findings.ts';

/** One finding: what is wrong, where, and (opened) the working, the numbers and the sources. */
export function FindingRow({
  finding,
  links,
  hrefOf,
  open,
  onToggle,
}: {
  finding: Finding;
  links: SubjectLink[];
  hrefOf: (link: SubjectLink) => string;
  open: boolean;
  onToggle: () => void;
}) {
  const panelId = useId();
  const values = Object.entries(finding.values);
  return (
    <li
      id={finding.id}
      aria-labelledby={`${panelId}-title`}
      className="scroll-mt-4 border-b border-rule/70 px-4 py-3.5 last:border-0"
    >
      <div className="grid gap-x-4 gap-y-1 sm:grid-cols-[7.5rem_minmax(0,1fr)_auto]">
        <div className="pt-0.5">
          <SeverityLabel severity={finding.severity} />
        </div>
        <div>
          <h3 id={`${panelId}-title`} className="font-semibold text-ink">
            {finding.title}
          </h3>
          <p className="mt-0.5 text-ink-soft">{finding.message}</p>
          <div className="mt-1.5 flex flex-wrap items-baseline gap-x-4 gap-y-1 text-sm">
            {links.map((link) => (
              <Link
                key={`${link.kind}-${link.id}`}
                to={hrefOf(link)}
                className="font-medium text-ink underline decoration-rule-strong underline-offset-4 hover:decoration-copper"
              >
                {link.label}
              </Link>
            ))}
            <span className="text-ink-faint">
              Source: {finding.sources.map((s) => s.title).join(' · ')}
            </span>
          </div>
        </div>
        <div className="sm:text-right">
          <button
            type="button"
            aria-expanded={open}
            aria-controls={panelId}
            onClick={onToggle}
            className="inline-flex items-center gap-1.5 rounded-md px-2 py-1 text-sm font-medium text-ink-soft hover:bg-paper-sunk hover:text-ink"
          >
            <span
              aria-hidden
              className={`inline-block transition-transform ${open ? 'rotate-90' : ''}`}
            >
              ▸
            </span>
            {open ? 'Hide working' : 'Show working'}
            <span className="sr-only">: {finding.title}</span>
          </button>
        </div>
      </div>
      {open ? (
        <div
          id={panelId}
          role="region"
          aria-label={`Working: ${finding.title}`}
          className="mt-3 grid gap-5 rounded-md border border-rule bg-paper p-4 sm:ml-[8.5rem] lg:grid-cols-2"
        >
          <div>
            <h4 className="mb-1.5 text-sm font-semibold">Working</h4>
            {finding.working.length ? (
              <ol className="list-decimal space-y-1 pl-5 text-sm text-ink-soft marker:text-ink-faint">
                {finding.working.map((line, i) => (
                  <li key={i}>{line}</li>
                ))}
              </ol>
            ) : (
              <p className="text-sm text-ink-faint">Nothing to calculate for this rule.</p>
            )}
          </div>
          <div>
            {values.length ? (
              <table className="lw-table w-full border-collapse text-sm">
                <caption className="mb-1.5 text-left text-sm font-semibold">The numbers</caption>
                <thead className="sr-only">
                  <tr>
                    <th scope="col">Quantity</th>
                    <th scope="col">Value</th>
                  </tr>
                </thead>
                <tbody>
                  {values.map(([key, v]) => (
                    <tr key={key} className="border-b border-rule/60 last:border-0">
                      <th scope="row" className="py-1 pr-4 font-normal">
                        {v.label}
                      </th>
                      <td className="py-1 text-right font-mono whitespace-nowrap">
                        {formatFindingValue(v)}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            ) : null}
            <h4 className="mt-4 mb-1.5 text-sm font-semibold">Sources</h4>
            <ul className="space-y-1 text-sm">
              {finding.sources.map((s) => (
                <li key={s.id}>
                  <span className="font-medium">{s.title}</span>
                  <span className="text-ink-faint"> — {s.citation}</span>
                </li>
              ))}
            </ul>
          </div>
        </div>
      ) : null}
    </li>
  );
}
