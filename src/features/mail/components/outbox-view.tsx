import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useOutbox } from '../api/outbox.ts';
import { formatDate } from '@/lib/format-date.ts';

const STATUS = {
  pending: '◔ Waiting',
  sending: '→ Sending',
  sent: '✓ Sent',
  failed: '✕ Gave up',
} as const;

/** What Loomwright queued to send, and (in demo mode) what the local fake mail server received. */
export function OutboxView() {
  const outbox = useOutbox();
  if (outbox.isPending) return <Loading what="Loading the outbox" />;
  if (outbox.isError) {
    return (
      <Notice tone="fault" title="The outbox could not be loaded">
        {outbox.error.message}
      </Notice>
    );
  }
  const { outbox: rows, received } = outbox.data;
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="outbox-heading">
        <h2 id="outbox-heading" className="mb-2 text-lg font-semibold">
          Notices queued
        </h2>
        <div className="overflow-x-auto rounded-lg border border-rule bg-paper-raised">
          <table className="lw-table w-full border-collapse text-sm">
            <caption className="sr-only">Notices queued for sending</caption>
            <thead className="border-b border-rule bg-paper-sunk/60">
              <tr>
                <th className="px-3 py-2">Queued</th>
                <th className="px-3 py-2">To</th>
                <th className="px-3 py-2">Subject</th>
                <th className="px-3 py-2">Status</th>
                <th className="px-3 py-2">Tries</th>
              </tr>
            </thead>
            <tbody>
              {rows.length === 0 ? (
                <tr>
                  <td colSpan={5} className="px-3 py-4 text-ink-faint">
                    Nothing queued yet.
                  </td>
                </tr>
              ) : (
                rows.map((r) => (
                  <tr key={r.id} className="border-b border-rule/70 last:border-0">
                    <td className="px-3 py-2 whitespace-nowrap">{formatDate(r.createdAt)}</td>
                    <td className="px-3 py-2 font-mono">{r.to}</td>
                    <td className="px-3 py-2">{r.subject}</td>
                    <td className="px-3 py-2 whitespace-nowrap">
                      {STATUS[r.status]}
                      {r.lastError && r.status !== 'sent' ? (
                        <span className="block text-xs text-fault">{r.lastError}</span>
                      ) : null}
                    </td>
                    <td className="px-3 py-2 font-mono">{r.attempts}</td>
                  </tr>
                ))
              )}
            </tbody>
          </table>
        </div>
      </section>
      {received ? (
        <section aria-labelledby="received-heading">
          <h2 id="received-heading" className="mb-1 text-lg font-semibold">
            Received by the demo mail server
          </h2>
          <p className="mb-2 text-sm text-ink-soft">
            In demo mode Loomwright sends mail to a local stand-in server; nothing leaves this
            machine.
          </p>
          <ol className="flex flex-col gap-2">
            {received.map((m, i) => (
              <li key={i} className="rounded-lg border border-rule bg-paper-raised px-4 py-3">
                <p className="text-sm text-ink-faint">
                  {formatDate(m.receivedAt)} · to{' '}
                  <span className="font-mono">{m.to.join(', ')}</span>
                </p>
                <p className="font-semibold">{m.subject}</p>
                <details>
                  <summary className="cursor-pointer text-sm text-ink-soft">Message</summary>
                  <pre className="mt-1 whitespace-pre-wrap font-sans text-sm">{m.text}</pre>
                </details>
              </li>
            ))}
          </ol>
        </section>
      ) : null}
    </div>
  );
}
