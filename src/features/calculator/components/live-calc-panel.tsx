import type { CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { useCalcRun } from '../api/run-calc.ts';
import { CalcResultView } from './calc-result.tsx';

/** The calculator's answer for inputs that are still being typed: asked once typing pauses. */
export function LiveCalcPanel({ request }: { request: CalcRequestInput }) {
  const calc = useCalcRun(request);
  if (calc.isError && !calc.data) {
    const issues = calc.error instanceof ApiError ? Object.entries(calc.error.fieldIssues()) : [];
    return (
      <Notice tone="caution" title="The calculator could not answer these inputs">
        {issues.length ? (
          <ul>
            {issues.map(([field, message]) => (
              <li key={field}>
                <span className="font-mono">{field}</span>: {message}
              </li>
            ))}
          </ul>
        ) : (
          calc.error.message
        )}
      </Notice>
    );
  }
  if (!calc.data) {
    return (
      <p role="status" className="py-4 text-sm text-ink-soft">
        Calculating…
      </p>
    );
  }
  return (
    <div aria-busy={calc.stale || undefined}>
      <p role="status" className="mb-1 h-5 text-xs text-ink-faint">
        {calc.stale ? 'Updating…' : ''}
      </p>
      <div className={calc.stale ? 'opacity-60 transition-opacity' : 'transition-opacity'}>
        <CalcResultView result={calc.data.result} request={calc.data.input} mode="compact" />
      </div>
    </div>
  );
}
