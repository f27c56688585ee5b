import { useMemo, useRef, useState } from 'react';
import type { CreateWireRequest, Wire, WireEnd } from '#shared/schemas/harness.schema.ts';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { useBoxes } from '../api/boxes.ts';
import { useCreateWire } from '../api/create-wire.ts';
import { useDeleteWire } from '../api/delete-wire.ts';
import { useCreateGroundPoint, useGroundPoints } from '../api/ground-points.ts';
import { useCreateSplice, useSplices } from '../api/splices.ts';
import { conflictWire, useUpdateWire } from '../api/update-wire.ts';
import { useWires, wiresCsvHref } from '../api/get-wires.ts';
import { endOptions } from '../lib/end-options.ts';
import { cellChange, withEnd, type WireColumnId } from '../lib/wire-cells.ts';
import { inversePatch, type WirePatch } from '../lib/wire-paste.ts';
import { AddWireForm } from './add-wire-form.tsx';
import { GroundPointForm, SpliceForm } from './small-forms.tsx';
import { SplicesAndGrounds } from './splices-and-grounds.tsx';
import { WireImport } from './wire-import.tsx';
import { WiresGrid } from './wires-grid.tsx';

interface WiresScreenProps {
  conversionId: number;
  readOnly: boolean;
  /** The pin map's pins and connectors, for the cavities an end can name. */
  pins: Pin[];
  connectors: Connector[];
}

type Panel = 'wire' | 'splice' | 'ground' | 'import' | null;
type Message = { tone: 'fault' | 'caution' | 'sound'; title: string; body?: string };

/** The wire list of a conversion: both ends of every wire, edited in place. */
export function WiresScreen({ conversionId, readOnly, pins, connectors }: WiresScreenProps) {
  const wires = useWires(conversionId);
  const splices = useSplices(conversionId);
  const grounds = useGroundPoints(conversionId);
  const boxes = useBoxes(conversionId);
  const createWire = useCreateWire(conversionId);
  const updateWire = useUpdateWire(conversionId);
  const deleteWire = useDeleteWire(conversionId);
  const createSplice = useCreateSplice(conversionId);
  const createGround = useCreateGroundPoint(conversionId);
  const [panel, setPanel] = useState<Panel>(null);
  const [message, setMessage] = useState<Message | null>(null);
  const [focusWireId, setFocusWireId] = useState<number | null>(null);
  // A new key empties the add-wire form for the next wire.
  const [addRound, setAddRound] = useState(0);
  // What each saved change overwrote, newest last: Ctrl+Z puts it back.
  const undoStack = useRef<Array<{ wireId: number; label: string; patch: WirePatch }>>([]);

  const options = useMemo(
    () =>
      endOptions({
        pins,
        connectors,
        splices: splices.data ?? [],
        groundPoints: grounds.data ?? [],
        boxes: boxes.data ?? [],
      }),
    [pins, connectors, splices.data, grounds.data, boxes.data],
  );
  const byKey = useMemo(() => new Map(options.map((o) => [o.key, o])), [options]);
  const feedOfPosition = useMemo(
    () => new Map((boxes.data ?? []).flatMap((b) => b.positions.map((p) => [p.id, p.feedId]))),
    [boxes.data],
  );

  if (wires.isPending) return <Loading what="Loading the wires" />;
  if (wires.isError) {
    return (
      <Notice tone="fault" title="The wires could not be loaded">
        {wires.error.message}
      </Notice>
    );
  }

  const save = (wire: Wire, patch: WirePatch, undoing = false) =>
    updateWire.mutate(
      { wireId: wire.id, input: { ...patch, version: wire.version } },
      {
        onSuccess: ({ wire: saved }) => {
          if (!undoing) {
            undoStack.current.push({
              wireId: wire.id,
              label: saved.label,
              patch: inversePatch(wire, patch),
            });
          }
          setMessage({
            tone: 'sound',
            title: undoing ? `Undid the last change to ${saved.label}` : `Saved ${saved.label}`,
            body: undoing ? undefined : 'Ctrl+Z in the list puts it back.',
          });
        },
        onError: (error) => {
          const current = conflictWire(error);
          setMessage(
            current
              ? {
                  tone: 'caution',
                  title: `${current.label} was changed by someone else; your change was not saved`,
                  body: 'The row now shows the current copy. Make the change again if it still stands.',
                }
              : { tone: 'fault', title: `${wire.label} was not saved`, body: error.message },
          );
        },
      },
    );
  const onUndo = () => {
    const last = undoStack.current.pop();
    const current = last && wires.data?.find((w) => w.id === last.wireId);
    if (!last || !current) {
      setMessage({ tone: 'caution', title: 'Nothing to undo' });
      return;
    }
    save(current, last.patch, true);
  };
  const onPatches = (patches: Array<{ wire: Wire; patch: WirePatch }>, problems: string[]) => {
    for (const { wire, patch } of patches) save(wire, patch);
    if (problems.length) {
      setMessage({
        tone: 'fault',
        title: 'Some pasted cells were not saved',
        body: problems.join('; '),
      });
    }
  };
  const onText = (wire: Wire, col: WireColumnId, text: string) => {
    const change = cellChange(col, text);
    if (!change.ok) setMessage({ tone: 'fault', title: change.message });
    else save(wire, change.patch);
  };
  const onEnd = (wire: Wire, col: 'endA' | 'endB', end: WireEnd) =>
    save(wire, { ends: withEnd(wire, col, end) });
  const onDelete = (wire: Wire) => {
    if (!window.confirm(`Delete wire ${wire.label}? Both its ends are let go.`)) return;
    deleteWire.mutate(wire.id, {
      onSuccess: () => setMessage({ tone: 'sound', title: `Deleted ${wire.label}` }),
      onError: (error) =>
        setMessage({ tone: 'fault', title: `${wire.label} was not deleted`, body: error.message }),
    });
  };
  const onAdd = (input: CreateWireRequest) =>
    createWire.mutate(input, {
      onSuccess: ({ wire }) => {
        setMessage({ tone: 'sound', title: `Added ${wire.label}` });
        setFocusWireId(wire.id);
        setAddRound((n) => n + 1);
      },
    });
  const circuitHref = (wire: Wire) => {
    const pin = wire.ends.find((e) => e.kind === 'pin');
    if (pin) return paths.conversionCircuit.getHref(conversionId, 'pin', pin.refId);
    for (const e of wire.ends) {
      if (e.kind !== 'relay' && e.kind !== 'fuse') continue;
      const feedId = feedOfPosition.get(e.refId);
      if (feedId) return paths.conversionCircuit.getHref(conversionId, 'feed', feedId);
    }
    return null;
  };
  const loose = wires.data.filter((w) => w.ends.some((e) => e.kind === 'unresolved')).length;
  const toggle = (p: Panel) => setPanel((now) => (now === p ? null : p));

  return (
    <div className="grid gap-4">
      <div className="flex flex-wrap items-center gap-2">
        <h2 className="mr-auto text-lg font-semibold">
          Wires <span className="font-normal text-ink-soft">({wires.data.length})</span>
          {loose ? (
            <span className="ml-2 text-sm font-normal text-caution">
              {loose} with an end not yet fastened
            </span>
          ) : null}
        </h2>
        {readOnly ? null : (
          <>
            <Button variant="primary" size="sm" onClick={() => toggle('wire')}>
              Add a wire
            </Button>
            <Button size="sm" onClick={() => toggle('splice')}>
              Add a splice
            </Button>
            <Button size="sm" onClick={() => toggle('ground')}>
              Add a ground point
            </Button>
            <Button size="sm" onClick={() => toggle('import')}>
              Import CSV
            </Button>
          </>
        )}
        <a
          href={wiresCsvHref(conversionId)}
          className="rounded-md border border-rule-strong px-2.5 py-1 text-sm font-medium hover:bg-paper-sunk"
        >
          Export CSV
        </a>
      </div>
      {panel === 'wire' ? (
        <AddWireForm
          key={addRound}
          focusFirst={addRound > 0}
          options={options}
          byKey={byKey}
          busy={createWire.isPending}
          error={createWire.error?.message ?? null}
          onAdd={onAdd}
          onClose={() => setPanel(null)}
        />
      ) : null}
      {panel === 'splice' ? (
        <SpliceForm
          busy={createSplice.isPending}
          error={createSplice.error}
          onSubmit={(v) =>
            createSplice.mutate(v, {
              onSuccess: ({ splice }) => {
                setMessage({ tone: 'sound', title: `Added splice ${splice.label}` });
                setPanel(null);
              },
            })
          }
          onCancel={() => setPanel(null)}
        />
      ) : null}
      {panel === 'ground' ? (
        <GroundPointForm
          busy={createGround.isPending}
          error={createGround.error}
          onSubmit={(v) =>
            createGround.mutate(v, {
              onSuccess: ({ groundPoint }) => {
                setMessage({ tone: 'sound', title: `Added ground point ${groundPoint.label}` });
                setPanel(null);
              },
            })
          }
          onCancel={() => setPanel(null)}
        />
      ) : null}
      {panel === 'import' ? (
        <WireImport conversionId={conversionId} onClose={() => setPanel(null)} />
      ) : null}
      {message ? (
        <Notice tone={message.tone} title={message.title}>
          {message.body}
        </Notice>
      ) : null}
      <SplicesAndGrounds
        conversionId={conversionId}
        wires={wires.data}
        splices={splices.data ?? []}
        groundPoints={grounds.data ?? []}
        readOnly={readOnly}
        onNotice={(tone, title, body) => setMessage({ tone, title, body })}
      />
      <p className="text-xs text-ink-faint">
        {readOnly
          ? 'Read only: your role cannot change wires. Arrows move through the list.'
          : 'Arrows move; Enter or typing edits a cell; Enter saves and goes down, Tab saves and goes right, Escape leaves it as it was; Ctrl+C, Ctrl+V, Ctrl+D fills down, Ctrl+Z undoes. An end is picked from the list: type part of a cavity, splice, ground point, relay or fuse.'}
      </p>
      <WiresGrid
        wires={wires.data}
        options={options}
        byKey={byKey}
        readOnly={readOnly}
        onText={onText}
        onEnd={onEnd}
        onDelete={onDelete}
        onPatches={onPatches}
        onUndo={onUndo}
        circuitHref={circuitHref}
        focusWireId={focusWireId}
      />
    </div>
  );
}
