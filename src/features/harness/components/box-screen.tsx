import { useMemo, useState } from 'react';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { conflictBox, useBoxes, useCreateBox, useUpdateBox } from '../api/boxes.ts';
import { useWires } from '../api/get-wires.ts';
import { useGroundPoints } from '../api/ground-points.ts';
import { useSplices } from '../api/splices.ts';
import { wiresByTerminal } from '../lib/box-terminals.ts';
import { endOptions } from '../lib/end-options.ts';
import { AddBoxForm } from './add-box-form.tsx';
import { BoxCard } from './box-card.tsx';
import { BoxPositionsForm } from './box-positions-form.tsx';

interface BoxScreenProps {
  conversionId: number;
  readOnly: boolean;
  pins: Pin[];
  connectors: Connector[];
  /** Feed names by id, from the feeds the route knows. */
  feedNames: ReadonlyMap<number, string>;
}

type Message = { tone: 'fault' | 'caution' | 'sound'; title: string; body?: string };

/** The relay and fuse boxes: each position drawn with what every terminal is wired to. */
export function BoxScreen({ conversionId, readOnly, pins, connectors, feedNames }: BoxScreenProps) {
  const boxes = useBoxes(conversionId);
  const wires = useWires(conversionId);
  const splices = useSplices(conversionId);
  const grounds = useGroundPoints(conversionId);
  const update = useUpdateBox(conversionId);
  const create = useCreateBox(conversionId);
  const [adding, setAdding] = useState(false);
  const [editing, setEditing] = useState<number | null>(null);
  const [message, setMessage] = useState<Message | null>(null);

  const byKey = useMemo(() => {
    const options = endOptions({
      pins,
      connectors,
      splices: splices.data ?? [],
      groundPoints: grounds.data ?? [],
      boxes: boxes.data ?? [],
    });
    return new Map(options.map((o) => [o.key, o]));
  }, [pins, connectors, splices.data, grounds.data, boxes.data]);
  const terminals = useMemo(() => wiresByTerminal(wires.data ?? []), [wires.data]);

  if (boxes.isPending || wires.isPending) return <Loading what="Loading the box" />;
  if (boxes.isError || wires.isError) {
    return (
      <Notice tone="fault" title="The box could not be loaded">
        {(boxes.error ?? wires.error)?.message}
      </Notice>
    );
  }
  const feedName = (id: number | null) => (id === null ? null : (feedNames.get(id) ?? null));

  return (
    <div className="grid gap-6">
      {boxes.data.length === 0 ? (
        <Notice title="This conversion has no relay and fuse box yet.">
          {readOnly ? null : 'Add one, then its fuses and relays as positions.'}
        </Notice>
      ) : null}
      {readOnly ? null : adding ? (
        <AddBoxForm
          busy={create.isPending}
          error={create.error}
          onCancel={() => setAdding(false)}
          onSubmit={(values) =>
            create.mutate(values, {
              onSuccess: ({ box }) => {
                setAdding(false);
                setEditing(box.id);
                setMessage({ tone: 'sound', title: `Added the box ${box.label}` });
              },
            })
          }
        />
      ) : (
        <div>
          <Button size="sm" onClick={() => setAdding(true)}>
            Add a box
          </Button>
        </div>
      )}
      {message ? (
        <Notice tone={message.tone} title={message.title}>
          {message.body}
        </Notice>
      ) : null}
      {boxes.data.map((box) => (
        <div key={box.id} className="grid gap-3">
          <BoxCard box={box} terminals={terminals} byKey={byKey} feedName={feedName} />
          {readOnly ? null : editing === box.id ? (
            <BoxPositionsForm
              key={box.version}
              box={box}
              busy={update.isPending}
              error={update.error && !conflictBox(update.error) ? update.error.message : null}
              onCancel={() => setEditing(null)}
              onSave={(positions) =>
                update.mutate(
                  { boxId: box.id, input: { positions, version: box.version } },
                  {
                    onSuccess: ({ box: saved }) => {
                      setEditing(null);
                      setMessage({ tone: 'sound', title: `Saved the positions of ${saved.label}` });
                    },
                    onError: (error) => {
                      if (conflictBox(error)) {
                        setMessage({
                          tone: 'caution',
                          title: `${box.label} was changed by someone else; your change was not saved`,
                          body: 'The box now shows the current positions. Make the change again if it still stands.',
                        });
                      }
                    },
                  },
                )
              }
            />
          ) : (
            <div>
              <Button size="sm" onClick={() => setEditing(box.id)}>
                Edit positions<span className="sr-only"> of {box.label}</span>
              </Button>
            </div>
          )}
        </div>
      ))}
    </div>
  );
}
