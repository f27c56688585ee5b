import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useMemo, useState, useSyncExternalStore } from 'react';
import type { Pin, PinChanges } from '#shared/schemas/pin-map.schema.ts';
import { useBatchUpdatePins } from '../api/batch-update-pins.ts';
import { useBulkUpdatePins } from '../api/bulk-update-pins.ts';
import { pinMapKeys } from '../api/keys.ts';
import type { PinWriteListeners, PinWriteProblem } from '../api/pin-write-cache.ts';
import { useUpdatePin } from '../api/update-pin.ts';
import { pinsById } from '../lib/pin-cache.ts';
import type { PinEdit } from '../lib/pin-edits.ts';
import {
  dropUndo,
  popUndo,
  pushUndo,
  undoEdits,
  undoEntryFor,
  type UndoEntry,
} from '../lib/undo.ts';

export interface PinMapMessage {
  id: number;
  tone: 'fault' | 'caution' | 'sound' | 'info';
  title: string;
  items?: string[];
}

let nextId = 1;

/**
 * The undo history, held outside React state: an edit that pushes an entry redraws what shows
 * the history (the Undo button) and not the whole pin map, and undo always reads the newest.
 */
export function createUndoHistory() {
  let stack: UndoEntry[] = [];
  const listeners = new Set<() => void>();
  return {
    get: () => stack,
    update(change: (stack: UndoEntry[]) => UndoEntry[]) {
      stack = change(stack);
      for (const listener of listeners) listener();
    },
    subscribe(listener: () => void) {
      listeners.add(listener);
      return () => {
        listeners.delete(listener);
      };
    },
  };
}

export type UndoHistory = ReturnType<typeof createUndoHistory>;

/** Whether there is something to undo, and what, for the Undo button. */
export function useUndoSummary(history: UndoHistory) {
  const stack = useSyncExternalStore(history.subscribe, history.get);
  return { canUndo: stack.length > 0, nextUndo: stack.at(-1)?.what ?? null };
}

/**
 * Every change to pins on the pin map goes through here: one cell (PATCH), the same values on a
 * selection (bulk), or many different cells (batch: paste, fill down, undo). Each change is
 * recorded for undo before it is sent, and forgotten again if the server refuses it.
 */
export function usePinEditing(conversionId: number) {
  const queryClient = useQueryClient();
  const [history] = useState(createUndoHistory);
  const [messages, setMessages] = useState<PinMapMessage[]>([]);

  const notify = useCallback((message: Omit<PinMapMessage, 'id'>) => {
    const id = nextId++;
    // A passing note replaces the last one; problems stay until dismissed (the last four).
    const passing = (m: Pick<PinMapMessage, 'tone'>) => m.tone === 'info' || m.tone === 'sound';
    setMessages((old) =>
      [...old.filter((m) => !(passing(m) && passing(message))), { ...message, id }].slice(-4),
    );
    return id;
  }, []);

  const dismiss = useCallback((id: number) => {
    setMessages((old) => old.filter((m) => m.id !== id));
  }, []);

  const listeners = useMemo<PinWriteListeners>(
    () => ({
      onProblem: (problem: PinWriteProblem) => {
        const undoId = problem.undoId;
        if (undoId) history.update((stack) => dropUndo(stack, undoId));
        notify({ tone: problem.conflict ? 'caution' : 'fault', title: problem.message });
      },
    }),
    [notify, history],
  );

  const { mutate: mutateSingle } = useUpdatePin(conversionId, listeners);
  const { mutate: mutateBulk } = useBulkUpdatePins(conversionId, listeners);
  const { mutate: mutateBatch } = useBatchUpdatePins(conversionId, listeners);

  const currentPins = useCallback(
    () => pinsById(queryClient.getQueryData<Pin[]>(pinMapKeys.pins(conversionId)) ?? []),
    [queryClient, conversionId],
  );

  const remember = useCallback(
    (what: string, edits: PinEdit[]) => {
      const entry = undoEntryFor(`undo-${nextId++}`, what, currentPins(), edits);
      history.update((stack) => pushUndo(stack, entry));
      return entry.id;
    },
    [currentPins, history],
  );

  /** One pin's changes as one PATCH; several pins' as one batch. */
  const write = useCallback(
    (edits: PinEdit[], what: string, via: 'auto' | 'batch' = 'auto') => {
      if (edits.length === 0) return;
      const undoId = remember(what, edits);
      if (edits.length === 1 && via === 'auto') {
        mutateSingle({ kind: 'single', edit: edits[0]!, what, undoId });
      } else {
        mutateBatch({ kind: 'batch', edits, what, undoId });
      }
    },
    [remember, mutateSingle, mutateBatch],
  );

  /** The same values on many pins at once (the selection toolbar). */
  const writeSelection = useCallback(
    (pinIds: number[], set: PinChanges, what: string) => {
      if (pinIds.length === 0) return;
      const undoId = remember(
        what,
        pinIds.map((id) => ({ id, set })),
      );
      mutateBulk({ kind: 'bulk', pinIds, set, what, undoId });
    },
    [remember, mutateBulk],
  );

  const undo = useCallback(() => {
    const popped = popUndo(history.get());
    if (!popped) {
      notify({ tone: 'info', title: 'Nothing to undo.' });
      return;
    }
    history.update(() => popped.rest);
    mutateBatch({
      kind: 'batch',
      edits: undoEdits(popped.entry),
      what: `undo of ${popped.entry.what}`,
    });
    notify({ tone: 'info', title: `Undone: ${popped.entry.what}.` });
  }, [history, mutateBatch, notify]);

  return {
    write,
    writeSelection,
    undo,
    history,
    messages,
    notify,
    dismiss,
  };
}

export type PinEditing = ReturnType<typeof usePinEditing>;
