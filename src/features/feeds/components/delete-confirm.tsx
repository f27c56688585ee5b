import { useId } from 'react';
import { Button } from '@/components/ui/button.tsx';

/** Asks before a feed is deleted, naming what goes with it. */
export function DeleteConfirm({
  feedName,
  busy,
  onDelete,
  onKeep,
}: {
  feedName: string;
  busy: boolean;
  onDelete: () => void;
  onKeep: () => void;
}) {
  const id = useId();
  return (
    <div
      role="alertdialog"
      aria-labelledby={id}
      className="flex flex-wrap items-center gap-3 rounded-md border border-fault/40 bg-fault-wash px-4 py-3"
    >
      <p id={id} className="text-sm font-semibold text-ink">
        Delete the feed “{feedName}” and its loads? Pins joined to it lose their destination.
      </p>
      <div className="ml-auto flex gap-2">
        <Button variant="danger" busy={busy} onClick={onDelete}>
          Delete feed
        </Button>
        <Button variant="quiet" onClick={onKeep}>
          Keep it
        </Button>
      </div>
    </div>
  );
}
