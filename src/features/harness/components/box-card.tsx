import { Link } from 'react-router-dom';
import { FUSE_FAMILIES, fuseColour } from '#shared/domain/electrical/fuses.ts';
import type { Box, BoxPosition } from '#shared/schemas/harness.schema.ts';
import { paths } from '@/config/paths.ts';
import { endText, type EndOption } from '../lib/end-options.ts';
import {
  RELAY_TERMINAL_ROLES,
  terminalWires,
  terminalsOf,
  type TerminalWire,
} from '../lib/box-terminals.ts';

interface BoxCardProps {
  box: Box;
  terminals: ReadonlyMap<string, TerminalWire[]>;
  byKey: ReadonlyMap<string, EndOption>;
  feedName: (feedId: number | null) => string | null;
}

function PositionHead({ p }: { p: BoxPosition }) {
  if (p.kind === 'fuse') {
    const colour = fuseColour(p.ratingA, p.fuseType);
    return (
      <>
        <span className="text-xs uppercase tracking-wide text-ink-faint">Fuse</span>
        <span className="font-mono text-lg font-semibold">{p.label}</span>
        <span className="text-sm">
          <strong>{p.ratingA} A</strong>
          {colour ? ` · ${colour}` : ''}
        </span>
        <span className="text-xs text-ink-soft">{FUSE_FAMILIES[p.fuseType].label}</span>
      </>
    );
  }
  return (
    <>
      <span className="text-xs uppercase tracking-wide text-ink-faint">Relay</span>
      <span className="font-mono text-lg font-semibold">{p.label}</span>
      <span className="text-sm">
        contacts <strong>{p.contactRatingA} A</strong>
      </span>
      <span className="text-xs text-ink-soft">
        {p.coilResistanceOhm ? `coil ${p.coilResistanceOhm} Ω` : 'coil resistance not recorded'}
      </span>
    </>
  );
}

/** One box drawn as its positions, each with what every terminal is wired to. */
export function BoxCard({ box, terminals, byKey, feedName }: BoxCardProps) {
  return (
    <section aria-label={`Box ${box.label}`} className="grid gap-3">
      <h2 className="text-lg font-semibold">{box.label}</h2>
      {box.notes ? <p className="text-sm text-ink-soft">{box.notes}</p> : null}
      {box.positions.length === 0 ? (
        <p className="text-sm text-ink-faint">No fuses or relays in this box yet.</p>
      ) : null}
      <ul className="grid gap-3 rounded-lg border-2 border-ink/70 bg-paper-sunk/50 p-3 sm:grid-cols-2 xl:grid-cols-4">
        {box.positions.map((p) => {
          const feed = feedName(p.feedId);
          return (
            <li
              key={p.id}
              aria-label={`${p.kind === 'fuse' ? 'Fuse' : 'Relay'} ${p.label}`}
              className={`grid content-start gap-2 rounded-md border bg-paper-raised p-3 ${
                p.kind === 'relay' ? 'border-dashed border-ink-soft' : 'border-rule-strong'
              }`}
            >
              <div className="flex flex-col">
                <PositionHead p={p} />
                {feed && p.feedId ? (
                  <Link
                    to={paths.conversionCircuit.getHref(box.conversionId, 'feed', p.feedId)}
                    className="text-xs text-copper-deep underline-offset-2 hover:underline"
                  >
                    Feed: {feed} · show circuit
                  </Link>
                ) : null}
              </div>
              <dl className="grid gap-1 text-sm">
                {terminalsOf(p).map((t) => {
                  const wires = terminalWires(terminals, p, t);
                  return (
                    <div
                      key={t}
                      role="group"
                      aria-label={`${p.label} terminal ${t}`}
                      className="grid grid-cols-[3rem_1fr] gap-2 border-t border-rule/70 pt-1"
                    >
                      <dt
                        className="font-mono font-semibold"
                        title={p.kind === 'relay' ? RELAY_TERMINAL_ROLES[t] : undefined}
                      >
                        {t}
                      </dt>
                      <dd>
                        {wires.length === 0 ? (
                          <span className="text-ink-faint">not wired</span>
                        ) : (
                          wires.map(({ wire, far }) => (
                            <div key={wire.id}>
                              <span className="font-mono font-medium">{wire.label}</span>
                              <span aria-hidden className="mx-1 text-copper">
                                →
                              </span>
                              <span className="sr-only"> to </span>
                              {endText(far, byKey)}
                            </div>
                          ))
                        )}
                      </dd>
                    </div>
                  );
                })}
              </dl>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
