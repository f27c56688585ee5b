import { Notice } from '@/components/ui/notice.tsx';
import type { PinMapMessage } from '../hooks/use-pin-editing.ts';

/** What happened to the last changes: problems stay until dismissed, notes replace each other. */
export function PinMapMessages({
  messages,
  onDismiss,
}: {
  messages: PinMapMessage[];
  onDismiss: (id: number) => void;
}) {
  if (messages.length === 0) return null;
  return (
    <div className="flex flex-col gap-2">
      {messages.map((m) => (
        <div key={m.id} className="relative">
          <Notice tone={m.tone} title={m.title}>
            {m.items?.length ? (
              <ul className="list-disc pl-5">
                {m.items.map((item) => (
                  <li key={item}>{item}</li>
                ))}
              </ul>
            ) : null}
          </Notice>
          <button
            type="button"
            onClick={() => onDismiss(m.id)}
            className="absolute right-2 top-2 rounded px-2 py-0.5 text-xs text-ink-soft hover:bg-paper-sunk hover:text-ink"
          >
            Dismiss
          </button>
        </div>
      ))}
    </div>
  );
}
