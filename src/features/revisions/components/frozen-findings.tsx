import type { Finding } from '#shared/schemas/checks.schema.ts';
import { SeverityLabel } from '@/components/ui/severity.tsx';

/** The check findings frozen with a revision (errors are impossible: they block submission). */
export function FrozenFindings({ findings }: { findings: Finding[] }) {
  return (
    <section
      aria-labelledby="frozen-findings-heading"
      className="rounded-lg border border-rule bg-paper-raised p-5"
    >
      <h2 id="frozen-findings-heading" className="text-lg font-semibold">
        Check findings at submission
      </h2>
      {findings.length === 0 ? (
        <p className="mt-2 text-ink-soft">None: every check passed.</p>
      ) : null}
      <ul className="mt-2 flex flex-col gap-2">
        {findings.map((f) => (
          <li key={f.id}>
            <details className="rounded-md border border-rule px-3 py-2">
              <summary className="cursor-pointer">
                <span className="font-semibold">
                  <SeverityLabel severity={f.severity} className="mr-2 align-bottom" />
                  {f.title}
                </span>
                <span className="block text-sm text-ink-soft">{f.message}</span>
              </summary>
              {f.working.length ? (
                <ul className="mt-2 list-disc pl-5 font-mono text-xs text-ink-soft">
                  {f.working.map((w, i) => (
                    <li key={i}>{w}</li>
                  ))}
                </ul>
              ) : null}
              <p className="mt-2 text-xs text-ink-faint">Source: {f.source}</p>
            </details>
          </li>
        ))}
      </ul>
    </section>
  );
}
