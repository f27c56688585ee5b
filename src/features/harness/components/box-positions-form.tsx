import { useState } from 'react';
import { FUSE_FAMILIES, FUSE_TYPES, type FuseType } from '#shared/domain/electrical/fuses.ts';
import { BoxPositionInput, type Box } from '#shared/schemas/harness.schema.ts';
import { Button } from '@/components/ui/button.tsx';

/** One position as typed: numbers stay text until saved. */
interface Draft {
  kind: 'fuse' | 'relay';
  label: string;
  rating: string;
  fuseType: FuseType;
  coil: string;
  feedId: number | null;
}

const toDraft = (p: Box['positions'][number]): Draft =>
  p.kind === 'fuse'
    ? {
        kind: 'fuse',
        label: p.label,
        rating: String(p.ratingA),
        fuseType: p.fuseType,
        coil: '',
        feedId: p.feedId,
      }
    : {
        kind: 'relay',
        label: p.label,
        rating: String(p.contactRatingA),
        fuseType: 'standard_blade',
        coil: p.coilResistanceOhm === null ? '' : String(p.coilResistanceOhm),
        feedId: p.feedId,
      };

const number = (text: string) => (text.trim() === '' ? NaN : Number(text.replace(',', '.')));

function toInput(d: Draft) {
  return d.kind === 'fuse'
    ? BoxPositionInput.safeParse({
        kind: 'fuse',
        label: d.label,
        fuseType: d.fuseType,
        ratingA: number(d.rating),
        feedId: d.feedId,
      })
    : BoxPositionInput.safeParse({
        kind: 'relay',
        label: d.label,
        contactRatingA: number(d.rating),
        coilResistanceOhm: d.coil.trim() ? number(d.coil) : null,
        feedId: d.feedId,
      });
}

const nextLabel = (drafts: Draft[], prefix: 'F' | 'R') => {
  const used = drafts.map((d) => Number(/^[FR](\d+)$/i.exec(d.label)?.[1] ?? 0));
  return `${prefix}${Math.max(0, ...used) + 1}`;
};

const CELL = 'rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm';

/**
 * The box's positions as rows: a fuse's rating and family, a relay's contact rating and coil.
 * A position keeps its wires while its label stays the same.
 */
export function BoxPositionsForm({
  box,
  busy,
  error,
  onSave,
  onCancel,
}: {
  box: Box;
  busy: boolean;
  error: string | null;
  onSave: (positions: BoxPositionInput[]) => void;
  onCancel: () => void;
}) {
  const [drafts, setDrafts] = useState<Draft[]>(() => box.positions.map(toDraft));
  const [problems, setProblems] = useState<Record<number, string>>({});
  const change = (i: number, patch: Partial<Draft>) =>
    setDrafts((list) => list.map((d, j) => (j === i ? { ...d, ...patch } : d)));
  const add = (kind: 'fuse' | 'relay') =>
    setDrafts((list) => [
      ...list,
      {
        kind,
        label: nextLabel(list, kind === 'fuse' ? 'F' : 'R'),
        rating: kind === 'fuse' ? '15' : '30',
        fuseType: 'standard_blade',
        coil: '',
        feedId: null,
      },
    ]);

  const save = () => {
    const parsed = drafts.map(toInput);
    const found: Record<number, string> = {};
    parsed.forEach((r, i) => {
      if (!r.success) {
        const issue = r.error.issues[0];
        found[i] = `${issue?.path.join('.') || 'row'}: ${issue?.message ?? 'not valid'}`;
      }
    });
    setProblems(found);
    if (Object.keys(found).length === 0) onSave(parsed.map((r) => r.data!));
  };

  return (
    <form
      aria-label={`Positions of ${box.label}`}
      onSubmit={(e) => {
        e.preventDefault();
        save();
      }}
      className="grid gap-3 rounded-lg border border-rule bg-paper-raised p-4"
    >
      <h3 className="font-semibold">Positions of {box.label}</h3>
      <table className="w-fit text-sm">
        <thead>
          <tr className="text-left text-ink-soft">
            <th className="px-1 py-1 font-medium">Kind</th>
            <th className="px-1 py-1 font-medium">Label</th>
            <th className="px-1 py-1 font-medium">Rating (A)</th>
            <th className="px-1 py-1 font-medium">Fuse family / coil (Ω)</th>
            <th />
          </tr>
        </thead>
        <tbody>
          {drafts.map((d, i) => (
            <tr key={i} className="align-top">
              <td className="px-1 py-1">{d.kind === 'fuse' ? 'Fuse' : 'Relay'}</td>
              <td className="px-1 py-1">
                <input
                  aria-label={`Label of position ${i + 1}`}
                  value={d.label}
                  onChange={(e) => change(i, { label: e.target.value })}
                  className={`${CELL} w-20 font-mono`}
                />
              </td>
              <td className="px-1 py-1">
                <input
                  aria-label={`${d.kind === 'fuse' ? 'Fuse rating' : 'Contact rating'} of ${d.label}`}
                  inputMode="decimal"
                  value={d.rating}
                  onChange={(e) => change(i, { rating: e.target.value })}
                  className={`${CELL} w-20`}
                />
              </td>
              <td className="px-1 py-1">
                {d.kind === 'fuse' ? (
                  <select
                    aria-label={`Fuse family of ${d.label}`}
                    value={d.fuseType}
                    onChange={(e) => change(i, { fuseType: e.target.value as FuseType })}
                    className={CELL}
                  >
                    {FUSE_TYPES.map((t) => (
                      <option key={t} value={t}>
                        {FUSE_FAMILIES[t].label}
                      </option>
                    ))}
                  </select>
                ) : (
                  <input
                    aria-label={`Coil resistance of ${d.label}`}
                    inputMode="decimal"
                    placeholder="not recorded"
                    value={d.coil}
                    onChange={(e) => change(i, { coil: e.target.value })}
                    className={`${CELL} w-28`}
                  />
                )}
                {problems[i] ? <p className="mt-1 text-fault">{problems[i]}</p> : null}
              </td>
              <td className="px-1 py-1">
                <Button
                  size="sm"
                  variant="quiet"
                  aria-label={`Remove ${d.label}`}
                  onClick={() => setDrafts((list) => list.filter((_, j) => j !== i))}
                >
                  Remove
                </Button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-xs text-ink-faint">
        Wires stay fastened to a position as long as its label stays the same.
      </p>
      {error ? (
        <p role="alert" className="text-sm text-fault">
          {error}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button size="sm" onClick={() => add('fuse')}>
          Add a fuse
        </Button>
        <Button size="sm" onClick={() => add('relay')}>
          Add a relay
        </Button>
        <Button type="submit" variant="primary" size="sm" busy={busy} className="ml-auto">
          Save positions
        </Button>
        <Button size="sm" variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
