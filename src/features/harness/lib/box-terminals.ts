import {
  FUSE_TERMINALS,
  RELAY_TERMINALS,
  type BoxPosition,
  type Wire,
  type WireEnd,
} from '#shared/schemas/harness.schema.ts';

/** A wire fastened to a terminal, and where its other end goes. */
export interface TerminalWire {
  wire: Wire;
  far: WireEnd;
}

const key = (positionId: number, terminal: string) => `${positionId}:${terminal}`;

/** Every box terminal's wires, keyed "positionId:terminal". */
export function wiresByTerminal(wires: readonly Wire[]): Map<string, TerminalWire[]> {
  const map = new Map<string, TerminalWire[]>();
  for (const wire of wires) {
    wire.ends.forEach((end, i) => {
      if (end.kind !== 'relay' && end.kind !== 'fuse') return;
      const k = key(end.refId, end.terminal);
      const list = map.get(k) ?? [];
      list.push({ wire, far: wire.ends[1 - i]! });
      map.set(k, list);
    });
  }
  return map;
}

/** The terminals of a position in the order a builder reads them: in, out; 30, 87, 87a, 85, 86. */
export const terminalsOf = (p: BoxPosition): readonly string[] =>
  p.kind === 'relay' ? RELAY_TERMINALS : FUSE_TERMINALS;

export const terminalWires = (
  map: ReadonlyMap<string, TerminalWire[]>,
  p: BoxPosition,
  terminal: string,
) => map.get(key(p.id, terminal)) ?? [];

/** What each relay terminal does, by DIN 72552. */
export const RELAY_TERMINAL_ROLES: Record<string, string> = {
  '30': 'supply',
  '87': 'output (closed when energised)',
  '87a': 'output (closed at rest)',
  '85': 'coil',
  '86': 'coil',
};
