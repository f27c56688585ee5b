/**
 * What every pin write (one pin, a selection, a batch) does to the cached pins: shows the change
 * at once, puts the server's rows in place when it answers, and on failure puts back what was
 * there (or, on a version conflict, the other person's copy). Changes still waiting their turn are
 * laid over again each time, so a slow answer never hides a newer edit.
 */
import type { QueryClient } from '@tanstack/react-query';
import type { Connector, Pin, PinChanges } from '#shared/schemas/pin-map.schema.ts';
import { afterNextPaint } from '@/lib/after-paint.ts';
import { ApiError } from '@/lib/api-client.ts';
import { FEEDS_KEY_ROOT, HARNESS_KEY_ROOT } from '@/lib/shared-keys.ts';
import { applyEdits, pinsById, replacePins, valuesBefore } from '../lib/pin-cache.ts';
import type { PinEdit } from '../lib/pin-edits.ts';
import { connectorLabels, nameOfPin } from '../lib/rows.ts';
import { pinMapKeys } from './keys.ts';

interface PinWriteBase {
  /** The change in words, lower case, for messages: "colour of E1-5", "paste into 6 pins". */
  what: string;
  /** The undo entry recorded for this write, dropped if the write fails. */
  undoId?: string;
}

export type PinWrite =
  | (PinWriteBase & { kind: 'single'; edit: PinEdit })
  | (PinWriteBase & { kind: 'bulk'; pinIds: number[]; set: PinChanges })
  | (PinWriteBase & { kind: 'batch'; edits: PinEdit[] });

function editsOf(write: PinWrite): PinEdit[] {
  switch (write.kind) {
    case 'single':
      return [write.edit];
    case 'bulk':
      return write.pinIds.map((id) => ({ id, set: write.set }));
    case 'batch':
      return write.edits;
  }
}

export interface PinWriteProblem {
  /** "E1-5: someone else changed this pin…" — always names the pins. */
  message: string;
  conflict: boolean;
  pinIds: number[];
  undoId?: string;
}

export interface PinWriteListeners {
  onProblem?: (problem: PinWriteProblem) => void;
}

interface WriteContext {
  before: PinEdit[];
}

function listNames(names: string[]): string {
  if (names.length <= 4) return names.join(', ');
  return `${names.slice(0, 3).join(', ')} and ${names.length - 3} more`;
}

function conflictRows(error: ApiError): Pin[] {
  const current = (error.details as { current?: Pin | Pin[] } | undefined)?.current;
  if (!current) return [];
  return Array.isArray(current) ? current : [current];
}

/** The optimistic-update callbacks shared by the three pin write endpoints. */
export function pinWriteCache(
  queryClient: QueryClient,
  conversionId: number,
  listeners: PinWriteListeners,
) {
  const pinsKey = pinMapKeys.pins(conversionId);
  const readPins = () => queryClient.getQueryData<Pin[]>(pinsKey) ?? [];

  function namesOf(ids: readonly number[]): string[] {
    const labels = connectorLabels(
      queryClient.getQueryData<Connector[]>(pinMapKeys.connectors(conversionId)) ?? [],
    );
    const pins = pinsById(readPins());
    return ids.map((id) => {
      const pin = pins.get(id);
      return pin ? nameOfPin(pin, labels) : `pin ${id}`;
    });
  }

  /** Lays the changes of writes still waiting (other than `except`) over the pins. */
  function withPending(pins: Pin[], except: PinWrite): Pin[] {
    const pending = queryClient
      .getMutationCache()
      .findAll({ mutationKey: pinMapKeys.pinWrites(conversionId), status: 'pending' })
      .map((m) => m.state.variables as PinWrite | undefined)
      .filter((v): v is PinWrite => v !== undefined && v !== except);
    return pending.reduce((acc, write) => applyEdits(acc, editsOf(write)), pins);
  }

  return {
    /** The row's version as the cache holds it now, read when the write's turn comes. */
    versionOf(id: number): number {
      const pin = readPins().find((p) => p.id === id);
      if (!pin) {
        throw new ApiError(404, 'not_found', 'This pin is no longer in the conversion.');
      }
      return pin.version;
    },

    async onMutate(write: PinWrite): Promise<WriteContext> {
      await queryClient.cancelQueries({ queryKey: pinsKey });
      const pins = pinsById(readPins());
      const edits = editsOf(write);
      const before = edits.flatMap((edit) => {
        const pin = pins.get(edit.id);
        return pin ? [{ id: edit.id, set: valuesBefore(pin, edit.set) }] : [];
      });
      queryClient.setQueryData<Pin[]>(pinsKey, (old) => applyEdits(old ?? [], edits));
      // The grid already shows the change; the request (sent after this) waits for that frame to
      // be painted, so neither the fetch call nor the server's work holds the frame up.
      await afterNextPaint();
      return { before };
    },

    onSuccess(saved: Pin[], write: PinWrite) {
      queryClient.setQueryData<Pin[]>(pinsKey, (old) =>
        withPending(replacePins(old ?? [], saved), write),
      );
      // A destination that moved took its wire along on the server, and a pin joined to a feed
      // (or taken off one) changed that feed's loads; other edits leave both lists as they were.
      const edits = editsOf(write);
      if (edits.some((e) => 'destinationPinId' in e.set)) {
        void queryClient.invalidateQueries({ queryKey: [HARNESS_KEY_ROOT, conversionId] });
      }
      if (edits.some((e) => 'destinationFeedId' in e.set)) {
        void queryClient.invalidateQueries({ queryKey: [FEEDS_KEY_ROOT, conversionId] });
      }
    },

    onError(error: Error, write: PinWrite, context: WriteContext | undefined) {
      const ids = editsOf(write).map((e) => e.id);
      const conflict =
        error instanceof ApiError && error.status === 409 && error.code === 'version_conflict';
      const current = conflict ? conflictRows(error) : [];
      queryClient.setQueryData<Pin[]>(pinsKey, (old) => {
        const restored = applyEdits(old ?? [], context?.before ?? []);
        return withPending(replacePins(restored, current), write);
      });
      const single = write.kind === 'single';
      let message: string;
      if (conflict) {
        const names = namesOf(current.length ? current.map((p) => p.id) : ids);
        message = single
          ? `${names[0]}: someone else changed this pin since you loaded it. Your change (${write.what}) was not saved; the row now shows their copy.`
          : `${listNames(names)}: someone else changed ${names.length === 1 ? 'this pin since you loaded it' : 'these pins since you loaded them'}. Nothing from the ${write.what} was saved; the rows now show their copies.`;
      } else {
        const names = namesOf(ids);
        message = single
          ? `${names[0]}: your change (${write.what}) was not saved. ${error.message}`
          : `${listNames(names)}: the ${write.what} was not saved, nothing changed. ${error.message}`;
      }
      listeners.onProblem?.({ message, conflict, pinIds: ids, undoId: write.undoId });
    },
  };
}
