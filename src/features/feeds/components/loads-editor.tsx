import { LOAD_KIND_LABELS, LOAD_KINDS, type LoadKind } from '#shared/domain/electrical/relays.ts';
import { Button } from '@/components/ui/button.tsx';
import { newLoadRow, type LoadRow } from '../lib/feed-form.ts';
import type { PinChoice } from '../lib/feed-display.ts';
import { PinOptions } from './pin-options.tsx';

const CELL =
  'w-full rounded-md border border-rule-strong bg-paper-raised px-2.5 py-1.5 text-ink aria-[invalid=true]:border-fault disabled:bg-paper-sunk/40';

function CellError({ id, message }: { id: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 text-xs text-fault">
      <span aria-hidden>✕ </span>
      {message}
    </p>
  );
}

/** The loads on a feed: a pin of the map or a named device, its current, continuous or not. */
export function LoadsEditor({
  loads,
  pins,
  errorOf,
  readOnly,
  onChange,
}: {
  loads: LoadRow[];
  pins: PinChoice[];
  /** The mark at a request path, e.g. "loads.0.currentA". */
  errorOf: (path: string) => string | undefined;
  readOnly: boolean;
  onChange: (loads: LoadRow[]) => void;
}) {
  const update = (index: number, patch: Partial<LoadRow>) =>
    onChange(loads.map((l, i) => (i === index ? { ...l, ...patch } : l)));

  return (
    <div>
      <div className="overflow-x-auto rounded-md border border-rule">
        <table className="lw-table w-full border-collapse text-sm">
          <caption className="sr-only">Loads on this feed</caption>
          <thead className="bg-paper-sunk/60">
            <tr>
              <th scope="col" className="w-[38%] px-2 py-1.5">
                Pin
              </th>
              <th scope="col" className="px-2 py-1.5">
                Device
              </th>
              <th scope="col" className="w-24 px-2 py-1.5">
                Current (A)
              </th>
              <th scope="col" className="w-28 px-2 py-1.5">
                Continuous
              </th>
              <th scope="col" className="w-32 px-2 py-1.5">
                Kind
              </th>
              {readOnly ? null : (
                <th scope="col" className="w-10 px-2 py-1.5">
                  <span className="sr-only">Remove</span>
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {loads.length === 0 ? (
              <tr>
                <td colSpan={6} className="px-2 py-3 text-center text-ink-faint">
                  No loads yet.
                </td>
              </tr>
            ) : null}
            {loads.map((load, i) => {
              const n = i + 1;
              const nameError = errorOf(`loads.${i}.name`) ?? errorOf(`loads.${i}.pinId`);
              const currentError = errorOf(`loads.${i}.currentA`);
              return (
                <tr key={load.key} className="border-t border-rule/70 align-top">
                  <td className="px-2 py-1.5">
                    <select
                      aria-label={`Load ${n} pin`}
                      className={`${CELL} min-w-[9rem]`}
                      value={load.pinId}
                      onChange={(e) => update(i, { pinId: e.target.value })}
                    >
                      <option value="">— a named device —</option>
                      <PinOptions pins={pins} />
                    </select>
                  </td>
                  <td className="px-2 py-1.5">
                    <input
                      aria-label={`Load ${n} device`}
                      aria-invalid={nameError ? true : undefined}
                      aria-describedby={nameError ? `load-${load.key}-name-error` : undefined}
                      className={`${CELL} min-w-[10rem]`}
                      value={load.name}
                      maxLength={80}
                      placeholder={load.pinId ? 'optional' : 'e.g. Electric cooling fan'}
                      onChange={(e) => update(i, { name: e.target.value })}
                    />
                    <CellError id={`load-${load.key}-name-error`} message={nameError} />
                  </td>
                  <td className="px-2 py-1.5">
                    <input
                      aria-label={`Load ${n} current (A)`}
                      aria-invalid={currentError ? true : undefined}
                      aria-describedby={currentError ? `load-${load.key}-current-error` : undefined}
                      inputMode="decimal"
                      className={`${CELL} font-mono`}
                      value={load.currentA}
                      onChange={(e) => update(i, { currentA: e.target.value })}
                    />
                    <CellError id={`load-${load.key}-current-error`} message={currentError} />
                  </td>
                  <td className="px-2 py-1.5">
                    <label className="inline-flex items-center gap-2 py-1.5">
                      <input
                        type="checkbox"
                        className="size-4 accent-copper"
                        checked={load.continuous}
                        onChange={(e) => update(i, { continuous: e.target.checked })}
                        aria-label={`Load ${n} continuous`}
                      />
                      <span aria-hidden>{load.continuous ? 'Yes' : 'No'}</span>
                    </label>
                  </td>
                  <td className="px-2 py-1.5">
                    <select
                      aria-label={`Load ${n} kind`}
                      title="Resistive: heaters, electronics. Motor: fans, pumps. Lamp: incandescent bulbs. A motor or lamp draws a surge at switch-on: its relay needs room for it."
                      className={CELL}
                      value={load.kind}
                      onChange={(e) => update(i, { kind: e.target.value as LoadKind })}
                    >
                      {LOAD_KINDS.map((k) => (
                        <option key={k} value={k}>
                          {LOAD_KIND_LABELS[k]}
                        </option>
                      ))}
                    </select>
                  </td>
                  {readOnly ? null : (
                    <td className="px-2 py-1.5">
                      <Button
                        variant="quiet"
                        size="sm"
                        aria-label={`Remove load ${n}`}
                        onClick={() => onChange(loads.filter((_, j) => j !== i))}
                      >
                        ✕
                      </Button>
                    </td>
                  )}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {errorOf('loads') ? (
        <p className="mt-1 text-sm text-fault">
          <span aria-hidden>✕ </span>
          {errorOf('loads')}
        </p>
      ) : null}
      {readOnly ? null : (
        <Button size="sm" className="mt-2" onClick={() => onChange([...loads, newLoadRow()])}>
          Add a load
        </Button>
      )}
    </div>
  );
}
