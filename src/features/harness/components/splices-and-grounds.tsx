import { useState } from 'react';
import {
  GROUND_LOCATION_LABELS,
  type GroundPoint,
  type Splice,
  type Wire,
} from '#shared/schemas/harness.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { useDeleteGroundPoint, useUpdateGroundPoint } from '../api/ground-points.ts';
import { useDeleteSplice, useUpdateSplice } from '../api/splices.ts';
import { GroundPointForm, SpliceForm } from './small-forms.tsx';

/** How many wire ends are fastened to each splice and ground point, keyed "kind:id". */
function endCounts(wires: readonly Wire[]) {
  const counts = new Map<string, number>();
  for (const w of wires) {
    for (const e of w.ends) {
      if (e.kind !== 'splice' && e.kind !== 'ground') continue;
      const key = `${e.kind}:${e.refId}`;
      counts.set(key, (counts.get(key) ?? 0) + 1);
    }
  }
  return counts;
}

const TH = 'px-2 py-1 text-left font-medium text-ink-soft';
const TD = 'px-2 py-1 align-top';

type Editing = { kind: 'splice'; item: Splice } | { kind: 'ground'; item: GroundPoint } | null;

/** The conversion's splices and ground points, with how many wires each joins; each can be changed. */
export function SplicesAndGrounds({
  conversionId,
  wires,
  splices,
  groundPoints,
  readOnly,
  onNotice,
}: {
  conversionId: number;
  wires: readonly Wire[];
  splices: readonly Splice[];
  groundPoints: readonly GroundPoint[];
  readOnly: boolean;
  /** What a change or removal came to, for the screen's notice. */
  onNotice: (tone: 'sound' | 'fault', title: string, body?: string) => void;
}) {
  const counts = endCounts(wires);
  const [editing, setEditing] = useState<Editing>(null);
  const updateSplice = useUpdateSplice(conversionId);
  const updateGround = useUpdateGroundPoint(conversionId);
  const removeSplice = useDeleteSplice(conversionId);
  const removeGround = useDeleteGroundPoint(conversionId);
  const open = (next: Editing) => {
    updateSplice.reset();
    updateGround.reset();
    setEditing(next);
  };
  const remove = (next: NonNullable<Editing>) => {
    const { label, id } = next.item;
    if (!window.confirm(`Remove ${label}? No wire is fastened to it.`)) return;
    const mutation = next.kind === 'splice' ? removeSplice : removeGround;
    mutation.mutate(id, {
      onSuccess: () => onNotice('sound', `Removed ${label}`),
      onError: (error) => onNotice('fault', `${label} was not removed`, error.message),
    });
  };
  /**
   * A row's buttons: Change opens the item in its form; Remove is offered while no wire is
   * fastened to it (the server refuses it otherwise).
   */
  const rowActions = (label: string, next: NonNullable<Editing>) =>
    readOnly ? null : (
      <td className={`${TD} whitespace-nowrap`}>
        <Button variant="quiet" aria-label={`Change ${label}`} onClick={() => open(next)}>
          Change
        </Button>
        {(counts.get(`${next.kind}:${next.item.id}`) ?? 0) === 0 ? (
          <Button variant="quiet" aria-label={`Remove ${label}`} onClick={() => remove(next)}>
            Remove
          </Button>
        ) : null}
      </td>
    );
  return (
    <details className="rounded-lg border border-rule bg-paper-raised px-4 py-2">
      <summary className="cursor-pointer text-sm font-semibold">
        Splices ({splices.length}) and ground points ({groundPoints.length})
      </summary>
      {editing?.kind === 'splice' ? (
        <div className="mt-2">
          <SpliceForm
            key={`splice-${editing.item.id}-${editing.item.version}`}
            initial={editing.item}
            busy={updateSplice.isPending}
            error={updateSplice.error}
            onSubmit={(values) =>
              updateSplice.mutate(
                { id: editing.item.id, input: { ...values, version: editing.item.version } },
                {
                  onSuccess: ({ splice }) => {
                    setEditing(null);
                    onNotice('sound', `Saved splice ${splice.label}`);
                  },
                },
              )
            }
            onCancel={() => setEditing(null)}
          />
        </div>
      ) : null}
      {editing?.kind === 'ground' ? (
        <div className="mt-2">
          <GroundPointForm
            key={`ground-${editing.item.id}-${editing.item.version}`}
            initial={editing.item}
            busy={updateGround.isPending}
            error={updateGround.error}
            onSubmit={(values) =>
              updateGround.mutate(
                { id: editing.item.id, input: { ...values, version: editing.item.version } },
                {
                  onSuccess: ({ groundPoint }) => {
                    setEditing(null);
                    onNotice('sound', `Saved ground point ${groundPoint.label}`);
                  },
                },
              )
            }
            onCancel={() => setEditing(null)}
          />
        </div>
      ) : null}
      <div className="mt-2 grid gap-4 lg:grid-cols-2">
        <table aria-label="Splices" className="self-start text-sm">
          <thead>
            <tr className="border-b border-rule">
              <th className={TH}>Splice</th>
              <th className={TH}>Wires</th>
              <th className={TH}>Sealed</th>
              <th className={TH}>Where</th>
              {readOnly ? null : (
                <th className={TH}>
                  <span className="sr-only">Actions</span>
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {splices.map((s) => (
              <tr key={s.id} className="border-b border-rule/60 last:border-0">
                <td className={`${TD} font-mono font-medium`}>{s.label}</td>
                <td className={TD}>{counts.get(`splice:${s.id}`) ?? 0}</td>
                <td className={TD}>{s.sealed ? 'sealed' : 'not sealed'}</td>
                <td className={TD}>
                  {[s.branch, s.distanceMm !== null ? `${s.distanceMm} mm from the datum` : '']
                    .filter(Boolean)
                    .join(', ') || '—'}
                  {s.notes ? <div className="text-xs text-ink-soft">{s.notes}</div> : null}
                </td>
                {rowActions(s.label, { kind: 'splice', item: s })}
              </tr>
            ))}
          </tbody>
        </table>
        <table aria-label="Ground points" className="self-start text-sm">
          <thead>
            <tr className="border-b border-rule">
              <th className={TH}>Ground</th>
              <th className={TH}>Wires</th>
              <th className={TH}>Location</th>
              <th className={TH}>Strap</th>
              {readOnly ? null : (
                <th className={TH}>
                  <span className="sr-only">Actions</span>
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {groundPoints.map((g) => (
              <tr key={g.id} className="border-b border-rule/60 last:border-0">
                <td className={`${TD} font-mono font-medium`}>{g.label}</td>
                <td className={TD}>{counts.get(`ground:${g.id}`) ?? 0}</td>
                <td className={TD}>
                  {GROUND_LOCATION_LABELS[g.location]}
                  {g.notes ? <div className="text-xs text-ink-soft">{g.notes}</div> : null}
                </td>
                <td className={TD}>{g.strapSizeMm2 !== null ? `${g.strapSizeMm2} mm²` : '—'}</td>
                {rowActions(g.label, { kind: 'ground', item: g })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
