import { onlineManager } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';
import { Notice } from '@/components/ui/notice.tsx';
import { useBenchQueue, useDismissBenchConflicts } from '../api/bench.ts';

const useOnline = () =>
  useSyncExternalStore(
    (notify) => onlineManager.subscribe(notify),
    () => onlineManager.isOnline(),
  );

/**
 * What has not reached the server yet: a count of waiting writes, and every write the server
 * refused (a conflict), which is shown until read rather than dropped.
 */
export function BenchQueueStatus({ conversionId }: { conversionId: number }) {
  const online = useOnline();
  const { waiting, failed } = useBenchQueue(conversionId);
  const dismiss = useDismissBenchConflicts();
  return (
    <>
      <p
        role="status"
        aria-live="polite"
        // While anything waits, the count stays in view however far down the list the technician is.
        className={`rounded-md border px-3 py-2 font-semibold ${waiting.length ? 'fixed right-4 bottom-4 z-30 border-2 border-caution bg-caution-wash text-lg text-caution shadow-lg' : 'border-rule text-ink-soft'}`}
      >
        {waiting.length ? (
          <>
            <span aria-hidden>⧗ </span>
            {waiting.length} waiting to send
            {online ? '' : ' · offline'}
          </>
        ) : online ? (
          'All saved'
        ) : (
          'Offline · nothing waiting'
        )}
      </p>
      {failed.length ? (
        <div className="basis-full">
          <Notice tone="fault" title={`${failed.length} not saved: the server refused them`}>
            <ul className="list-disc pl-5">
              {failed.map((f, i) => (
                <li key={`${f.input.key}-${f.at}-${i}`}>
                  <span className="font-semibold">{f.input.name}</span> (revision{' '}
                  {f.input.revisionNumber}): {f.error.message}
                </li>
              ))}
            </ul>
            <p className="mt-2">
              The checklist now shows what the server holds; tick again where needed.
            </p>
            <button
              type="button"
              className="mt-2 min-h-11 rounded-md border border-current px-4 font-medium"
              onClick={dismiss}
            >
              Understood
            </button>
          </Notice>
        </div>
      ) : null}
    </>
  );
}
