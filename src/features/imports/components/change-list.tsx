import { cavityName } from '#shared/domain/pin-names.ts';
import type { ImportChange, ImportSummary } from '#shared/schemas/imports.schema.ts';
import { plural } from '../lib/preview.ts';

const SHOWN = 300;

function Tally({ summary }: { summary: ImportSummary }) {
  const items = [
    { glyph: '+', word: 'added', n: summary.added },
    { glyph: '✎', word: 'changed', n: summary.changed },
    { glyph: '−', word: 'removed', n: summary.removed },
    { glyph: '=', word: 'unchanged', n: summary.unchanged },
  ];
  return (
    <ul className="flex flex-wrap gap-2 text-sm">
      {items.map((item) => (
        <li
          key={item.word}
          className="rounded border border-rule-strong bg-paper-raised px-2 py-0.5 whitespace-nowrap"
        >
          <span aria-hidden className="mr-1 font-mono text-copper-deep">
            {item.glyph}
          </span>
          {plural(item.n, 'cavity', 'cavities')} {item.word}
        </li>
      ))}
    </ul>
  );
}

const pinName = (c: { connector: string; cavity: string }) => cavityName(c.connector, c.cavity);

/**
 * What applying the file would do to the pins already there: cavities added, each changed field
 * with its value before and after, and blank cavities removed.
 */
export function ChangeList({
  changes,
  summary,
  title,
  partial,
}: {
  changes: ImportChange[];
  summary: ImportSummary;
  title: string;
  /** Some rows have problems and are not counted. */
  partial?: boolean;
}) {
  const changed = changes.filter(
    (c): c is Extract<ImportChange, { kind: 'change' }> => c.kind === 'change',
  );
  const added = changes.filter((c) => c.kind === 'add');
  const removed = changes.filter((c) => c.kind === 'remove');
  const fieldRows = changed.flatMap((c) => c.fields.map((f) => ({ pin: pinName(c), ...f })));
  return (
    <section aria-labelledby="import-changes" className="flex flex-col gap-3">
      <h3 id="import-changes" className="font-semibold">
        {title}
      </h3>
      <Tally summary={summary} />
      {partial ? (
        <p className="text-sm text-ink-soft">
          Rows with problems are not counted here; nothing is imported until they are fixed.
        </p>
      ) : null}
      {fieldRows.length ? (
        <div className="overflow-x-auto rounded-lg border border-rule bg-paper-raised">
          <table className="lw-table w-full border-collapse text-sm">
            <caption className="sr-only">Changed fields, before and after</caption>
            <thead className="border-b border-rule bg-paper-sunk/60">
              <tr>
                <th scope="col" className="px-3 py-2">
                  Pin
                </th>
                <th scope="col" className="px-3 py-2">
                  Field
                </th>
                <th scope="col" className="px-3 py-2">
                  Now
                </th>
                <th scope="col" className="px-3 py-2">
                  After the import
                </th>
              </tr>
            </thead>
            <tbody>
              {fieldRows.slice(0, SHOWN).map((f, i) => (
                <tr key={i} className="border-b border-rule/70 last:border-0">
                  <td className="px-3 py-1.5 font-mono text-xs">{f.pin}</td>
                  <td className="px-3 py-1.5">{f.label}</td>
                  <td className="px-3 py-1.5 text-ink-soft">
                    {f.before === '' ? <span className="text-ink-faint">—</span> : f.before}
                  </td>
                  <td className="px-3 py-1.5 font-medium">
                    {f.after === '' ? <span className="text-ink-faint">— (cleared)</span> : f.after}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {fieldRows.length > SHOWN ? (
            <p className="px-3 py-2 text-sm text-ink-soft">
              and {plural(fieldRows.length - SHOWN, 'more changed field')}.
            </p>
          ) : null}
        </div>
      ) : null}
      {added.length ? (
        <p className="text-sm">
          <span className="font-semibold">New cavities: </span>
          <span className="font-mono text-xs">
            {added.slice(0, 60).map(pinName).join(', ')}
            {added.length > 60 ? ` and ${added.length - 60} more` : ''}
          </span>
        </p>
      ) : null}
      {removed.length ? (
        <p className="text-sm">
          <span className="font-semibold">Removed (blank, not in the file): </span>
          <span className="font-mono text-xs">{removed.map(pinName).join(', ')}</span>
        </p>
      ) : null}
    </section>
  );
}
