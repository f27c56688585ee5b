import { useIsMutating } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button.tsx';
import { pinMapKeys } from '../api/keys.ts';
import { useUndoSummary, type UndoHistory } from '../hooks/use-pin-editing.ts';
import type { countDispositions } from '../lib/progress.ts';
import { DispositionTally } from './disposition-tally.tsx';

/**
 * The pin map's heading: the whole conversion's progress, whether edits are saved, undo and add.
 * It follows the writes in flight and the undo history itself, so they redraw only the heading.
 */
export function PinMapHeader({
  conversionId,
  counts,
  readOnly,
  history,
  onUndo,
  onFromLibrary,
  onAddConnector,
}: {
  conversionId: number;
  counts: ReturnType<typeof countDispositions>;
  readOnly: boolean;
  history: UndoHistory;
  onUndo: () => void;
  onFromLibrary: (() => void) | null;
  onAddConnector: () => void;
}) {
  const saving = useIsMutating({ mutationKey: pinMapKeys.pinWrites(conversionId) });
  const { canUndo, nextUndo } = useUndoSummary(history);
  return (
    <section
      aria-label="Progress of the whole conversion"
      className="flex flex-wrap items-start gap-x-8 gap-y-3"
    >
      <div className="min-w-72 flex-1">
        <h2 className="mb-1.5 text-lg font-semibold">Pin map</h2>
        <DispositionTally counts={counts} />
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <p role="status" className={`text-sm text-ink-soft ${readOnly ? 'hidden' : ''}`}>
          {saving ? (
            <span className="inline-flex items-center gap-1.5">
              <span aria-hidden className="size-2 rounded-full bg-copper" />
              Saving…
            </span>
          ) : (
            <span>
              <span aria-hidden>✓ </span>All changes saved
            </span>
          )}
        </p>
        {readOnly ? null : (
          <>
            <Button
              onClick={onUndo}
              disabled={!canUndo}
              title={nextUndo ? `Undo ${nextUndo} (Ctrl+Z in the grid)` : undefined}
            >
              <span aria-hidden>↶</span> Undo
              {nextUndo ? <span className="sr-only"> {nextUndo}</span> : null}
            </Button>
            {onFromLibrary ? (
              <Button onClick={onFromLibrary}>Add from the pinout library</Button>
            ) : null}
            <Button variant="primary" onClick={onAddConnector}>
              Add connector
            </Button>
          </>
        )}
      </div>
    </section>
  );
}

/** Where a connector is taken from the pinout library. */
export function FromLibraryPanel({
  onCancel,
  children,
}: {
  onCancel: () => void;
  children: ReactNode;
}) {
  return (
    <section
      aria-labelledby="from-library-heading"
      className="flex flex-col gap-3 rounded-lg border border-rule bg-paper-raised p-5"
    >
      <div className="flex items-start justify-between gap-3">
        <div>
          <h2 id="from-library-heading" className="text-lg font-semibold">
            Add a connector from the pinout library
          </h2>
          <p className="text-sm text-ink-soft">
            Its cavities, face and pin details come from the template; change them afterwards as you
            like.
          </p>
        </div>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
      {children}
    </section>
  );
}

/** A new conversion's first look at its pin map: three ways to bring in the donor's connectors. */
export function FirstRunPanel({
  onFromLibrary,
  importHref,
  onByHand,
}: {
  onFromLibrary: (() => void) | null;
  importHref: string | null | undefined;
  onByHand: () => void;
}) {
  return (
    <section
      aria-labelledby="first-run-heading"
      className="flex flex-col gap-3 rounded-lg border-2 border-dashed border-rule-strong bg-paper-raised p-6"
    >
      <h2 id="first-run-heading" className="text-lg font-semibold">
        Add the donor&rsquo;s ECU connectors: from the library, by CSV, or by hand
      </h2>
      <p className="max-w-3xl text-ink-soft">
        Each connector brings its cavities to the grid below, where every pin gets its function,
        wire and disposition. A connector the workshop has mapped before is in the pinout library; a
        pinout sheet can be imported as CSV; anything else, add by hand.
      </p>
      <div className="flex flex-wrap gap-2">
        {onFromLibrary ? (
          <Button variant="primary" onClick={onFromLibrary}>
            From the pinout library
          </Button>
        ) : null}
        {importHref ? (
          <Link
            to={importHref}
            className="rounded-md border border-rule-strong bg-paper px-4 py-2 font-medium hover:bg-paper-sunk"
          >
            Import a CSV
          </Link>
        ) : null}
        <Button onClick={onByHand}>By hand</Button>
      </div>
    </section>
  );
}
