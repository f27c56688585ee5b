/**
 * The harness as a graph, and the circuit of a feed or a pin read off it: from the source through
 * the fuse and relay, along wires and splices, to pins and devices and on to a ground point, with a
 * relay's coil path to the output that drives it. Pure: the checks, the diagrams and the worksheet
 * all read it.
 */
import type { SnapshotHarness, WireEnd } from '../../schemas/harness.schema.ts';
import { SOURCE_LABELS } from '../../schemas/harness.schema.ts';
import type { ConversionSnapshot } from '../../schemas/snapshot.schema.ts';
import { FUSE_FAMILIES, fuseColour } from '../electrical/fuses.ts';
import { cavityName } from '../pin-names.ts';
import { formatWireSize } from '../wire-sizes.ts';
import type { SizeUnit } from '../../schemas/workshop.schema.ts';

export type NodeKind = 'source' | 'fuse' | 'relay' | 'pin' | 'splice' | 'ground' | 'unresolved';

export interface CircuitNode {
  id: string;
  kind: NodeKind;
  /** First line: what it is ("F4", "S-03", "E2-10"). */
  title: string;
  /** Further lines: rating, location, function. */
  lines: string[];
}

export interface CircuitEdge {
  from: string;
  to: string;
  /** The wire's label, or "inside" for a device's own path. */
  label: string;
  wireId: number | null;
  /** The box terminal at each end, where the end is a relay or fuse ("87", "in"). */
  fromTerminal?: string | null;
  toTerminal?: string | null;
}

/** Relay terminals that carry the load (contacts) and those of the coil. */
const CONTACTS = new Set(['30', '87', '87a']);
const terminalGroup = (t: string | null | undefined) =>
  t == null ? null : CONTACTS.has(t) ? 'contacts' : 'coil';

export interface Circuit {
  title: string;
  nodes: CircuitNode[];
  edges: CircuitEdge[];
}

/** The node a wire end stands for. An unresolved end is a node of its own, one per wire end. */
export function endNodeId(end: WireEnd, wireId: number, index: number): string {
  switch (end.kind) {
    case 'pin':
    case 'splice':
    case 'ground':
    case 'relay':
    case 'fuse':
      return `${end.kind}:${end.refId}`;
    case 'source':
      return `source:${end.source}`;
    case 'unresolved':
      return `unresolved:${wireId}:${index}`;
  }
}

const terminalOf = (end: WireEnd) =>
  end.kind === 'relay' || end.kind === 'fuse' ? end.terminal : null;

export class HarnessGraph {
  readonly adjacency = new Map<string, CircuitEdge[]>();
  private readonly pinById: Map<number, ConversionSnapshot['pins'][number]>;
  private readonly connectorById: Map<number, ConversionSnapshot['connectors'][number]>;

  constructor(
    readonly snapshot: Pick<ConversionSnapshot, 'pins' | 'connectors' | 'feeds'>,
    readonly harness: SnapshotHarness,
    private readonly unit: SizeUnit = 'mm2',
  ) {
    this.pinById = new Map(snapshot.pins.map((p) => [p.id, p]));
    this.connectorById = new Map(snapshot.connectors.map((c) => [c.id, c]));
    for (const wire of harness.wires) {
      const [a, b] = wire.ends;
      const from = endNodeId(a, wire.id, 0);
      const to = endNodeId(b, wire.id, 1);
      const terminals = [terminalOf(a), terminalOf(b)];
      const named = terminals.filter(Boolean);
      const label = named.length
        ? `${wire.label} · ${terminals
            .map((t) => t ?? '')
            .join('→')
            .replace(/^→|→$/, '')}`
        : wire.label;
      this.link({
        from,
        to,
        label,
        wireId: wire.id,
        fromTerminal: terminals[0],
        toTerminal: terminals[1],
      });
    }
    // A device (a connector on the "other" side) carries current from one cavity to the next.
    const devicePins = new Map<number, number[]>();
    for (const p of snapshot.pins) {
      if (this.connectorById.get(p.connectorId)?.side !== 'other') continue;
      devicePins.set(p.connectorId, [...(devicePins.get(p.connectorId) ?? []), p.id]);
    }
    for (const ids of devicePins.values()) {
      for (let i = 1; i < ids.length; i++) {
        this.link({
          from: `pin:${ids[i - 1]}`,
          to: `pin:${ids[i]}`,
          label: 'inside',
          wireId: null,
        });
      }
    }
  }

  private link(edge: CircuitEdge) {
    this.adjacency.set(edge.from, [...(this.adjacency.get(edge.from) ?? []), edge]);
    this.adjacency.set(edge.to, [...(this.adjacency.get(edge.to) ?? []), edge]);
  }

  /** Whether a walk goes on past this node: through splices, box positions and devices only. */
  passesThrough(nodeId: string): boolean {
    const [kind, id] = nodeId.split(':');
    if (kind === 'splice' || kind === 'fuse' || kind === 'relay') return true;
    if (kind === 'pin') {
      const pin = this.pinById.get(Number(id));
      return this.connectorById.get(pin?.connectorId ?? -1)?.side === 'other';
    }
    return false;
  }

  /** Every node and edge reached from the start nodes, walking through what passes current on. */
  walk(starts: readonly string[]): { nodes: Set<string>; edges: CircuitEdge[] } {
    const nodes = new Set<string>();
    const edges = new Set<CircuitEdge>();
    const queue = [...starts];
    const expanded = new Set<string>();
    for (const s of starts) nodes.add(s);
    while (queue.length) {
      const at = queue.shift()!;
      if (expanded.has(at)) continue;
      expanded.add(at);
      for (const edge of this.adjacency.get(at) ?? []) {
        edges.add(edge);
        const next = edge.from === at ? edge.to : edge.from;
        nodes.add(next);
        if (this.passesThrough(next)) queue.push(next);
      }
    }
    return { nodes, edges: [...edges] };
  }

  /** A node as drawn: what it is and the facts a bench hand needs beside it. */
  describe(nodeId: string): CircuitNode {
    const [kind, rawId] = nodeId.split(':') as [NodeKind, string];
    const id = Number(rawId);
    switch (kind) {
      case 'source':
        return { id: nodeId, kind, title: SOURCE_LABELS[rawId as 'battery'] ?? rawId, lines: [] };
      case 'fuse':
      case 'relay': {
        for (const box of this.harness.boxes) {
          const p = box.positions.find((x) => x.id === id);
          if (!p) continue;
          if (p.kind === 'fuse') {
            const colour = fuseColour(p.ratingA, p.fuseType);
            return {
              id: nodeId,
              kind,
              title: `${p.label} fuse`,
              lines: [
                `${p.ratingA} A${colour ? ` ${colour}` : ''}`,
                FUSE_FAMILIES[p.fuseType].label,
              ],
            };
          }
          return {
            id: nodeId,
            kind,
            title: `${p.label} relay`,
            lines: [`contacts ${p.contactRatingA} A`, '30→87 contacts · 85/86 coil'],
          };
        }
        return { id: nodeId, kind, title: `${kind} (removed)`, lines: [] };
      }
      case 'pin': {
        const pin = this.pinById.get(id);
        const connector = this.connectorById.get(pin?.connectorId ?? -1);
        return {
          id: nodeId,
          kind,
          title: pin ? cavityName(connector?.label ?? '?', pin.cavity) : `pin ${id}`,
          lines: pin?.function ? [pin.function] : [],
        };
      }
      case 'splice': {
        const s = this.harness.splices.find((x) => x.id === id);
        return {
          id: nodeId,
          kind,
          title: s?.label ?? 'splice',
          lines: [s?.sealed ? 'sealed splice' : 'splice'],
        };
      }
      case 'ground': {
        const g = this.harness.groundPoints.find((x) => x.id === id);
        return {
          id: nodeId,
          kind,
          title: g ? `${g.label} ground` : 'ground',
          lines: g
            ? [
                g.location.replace('_', ' '),
                ...(g.strapSizeMm2 ? [`strap ${formatWireSize(g.strapSizeMm2, this.unit)}`] : []),
              ]
            : [],
        };
      }
      case 'unresolved': {
        const wire = this.harness.wires.find((w) => w.id === id);
        const end = wire?.ends[Number(nodeId.split(':')[2])];
        return {
          id: nodeId,
          kind,
          title: 'Not yet fastened',
          lines: [end?.kind === 'unresolved' && end.text ? end.text : 'far end to be named'],
        };
      }
    }
  }

  circuit(title: string, starts: readonly string[]): Circuit {
    const { nodes, edges } = this.walk(starts);
    return { title, nodes: [...nodes].map((n) => this.describe(n)), edges };
  }

  /** A feed's circuit: from its box positions (or its source) outwards. */
  feedCircuit(feedId: number): Circuit | null {
    const feed = this.snapshot.feeds.find((f) => f.id === feedId);
    if (!feed) return null;
    const starts = this.harness.boxes.flatMap((b) =>
      b.positions.filter((p) => p.feedId === feedId).map((p) => `${p.kind}:${p.id}`),
    );
    if (starts.length === 0) {
      for (const pin of feed.loads.map((l) => l.pinId).filter((p) => p != null)) {
        starts.push(`pin:${pin}`);
      }
    }
    return this.circuit(`Feed “${feed.name}”`, starts);
  }

  /** A pin's circuit: from the pin outwards. */
  pinCircuit(pinId: number): Circuit | null {
    const pin = this.pinById.get(pinId);
    if (!pin) return null;
    const connector = this.connectorById.get(pin.connectorId);
    const name = cavityName(connector?.label ?? '?', pin.cavity);
    return this.circuit(`Pin ${name}${pin.function ? ` — ${pin.function}` : ''}`, [`pin:${pinId}`]);
  }

  /**
   * The source a pin reaches by wire without passing a fuse, if any: through splices and relay
   * contacts, stopping at a fuse (the circuit is protected there).
   */
  unfusedSourceOf(pinId: number): string | null {
    // A relay is entered and left on the same side: its contacts (30, 87, 87a) or its coil.
    const start = { node: `pin:${pinId}`, group: null as string | null };
    const key = (s: { node: string; group: string | null }) => `${s.node}|${s.group ?? ''}`;
    const seen = new Set([key(start)]);
    const queue = [start];
    while (queue.length) {
      const at = queue.shift()!;
      for (const edge of this.adjacency.get(at.node) ?? []) {
        const leavingFrom = edge.from === at.node;
        const hereTerminal = leavingFrom ? edge.fromTerminal : edge.toTerminal;
        if (at.group && terminalGroup(hereTerminal) !== at.group) continue;
        const next = leavingFrom ? edge.to : edge.from;
        const nextTerminal = leavingFrom ? edge.toTerminal : edge.fromTerminal;
        const state = {
          node: next,
          group: next.startsWith('relay:') ? terminalGroup(nextTerminal) : null,
        };
        if (seen.has(key(state))) continue;
        seen.add(key(state));
        if (next.startsWith('source:')) return this.describe(next).title;
        if (next.startsWith('splice:') || next.startsWith('relay:')) queue.push(state);
      }
    }
    return null;
  }

  /** Whether any wire is fastened to this pin. */
  isWired(pinId: number): boolean {
    return (this.adjacency.get(`pin:${pinId}`) ?? []).some((e) => e.wireId != null);
  }

  /** The wires fastened to a pin. */
  wiresAt(pinId: number): CircuitEdge[] {
    return (this.adjacency.get(`pin:${pinId}`) ?? []).filter((e) => e.wireId != null);
  }

  /**
   * What a pin is joined to by wire through splices only (never through a box, a device or another
   * pin): the other pins on the same line and every wire of it. A bus line is read this way.
   */
  line(pinId: number): { pinIds: number[]; wireIds: number[]; spliceIds: number[] } {
    const start = `pin:${pinId}`;
    const pinIds: number[] = [];
    const wireIds = new Set<number>();
    const spliceIds: number[] = [];
    const seen = new Set([start]);
    const queue = [start];
    while (queue.length) {
      const at = queue.shift()!;
      for (const edge of this.adjacency.get(at) ?? []) {
        if (edge.wireId == null) continue;
        wireIds.add(edge.wireId);
        const next = edge.from === at ? edge.to : edge.from;
        if (seen.has(next)) continue;
        seen.add(next);
        const [kind, id] = next.split(':');
        if (kind === 'pin') pinIds.push(Number(id));
        if (kind === 'splice') {
          spliceIds.push(Number(id));
          queue.push(next);
        }
      }
    }
    return { pinIds, wireIds: [...wireIds], spliceIds };
  }

  /**
   * Whether a pin is fed from a relay's output (87): walking from the pin through splices and
   * fuses, never through relay contacts or a device, until a relay's 87 is met.
   */
  relayOutputFeeding(pinId: number): number | null {
    const start = `pin:${pinId}`;
    const seen = new Set([start]);
    const queue = [start];
    while (queue.length) {
      const at = queue.shift()!;
      for (const edge of this.adjacency.get(at) ?? []) {
        if (edge.wireId == null) continue;
        const leavingFrom = edge.from === at;
        const next = leavingFrom ? edge.to : edge.from;
        const nextTerminal = leavingFrom ? edge.toTerminal : edge.fromTerminal;
        if (next.startsWith('relay:') && nextTerminal === '87') return Number(next.split(':')[1]);
        if (seen.has(next)) continue;
        seen.add(next);
        if (next.startsWith('splice:') || next.startsWith('fuse:')) queue.push(next);
      }
    }
    return null;
  }

  /**
   * The ground points a pin reaches by wire, through splices and devices but never through an ECU
   * or another connector: the path the checks read a sensor ground's extra ground from.
   */
  groundsReached(pinId: number): Array<{ groundId: number; path: string[] }> {
    const found: Array<{ groundId: number; path: string[] }> = [];
    const start = `pin:${pinId}`;
    const previous = new Map<string, { node: string; label: string }>();
    const seen = new Set([start]);
    const queue = [start];
    while (queue.length) {
      const at = queue.shift()!;
      for (const edge of this.adjacency.get(at) ?? []) {
        const next = edge.from === at ? edge.to : edge.from;
        if (seen.has(next)) continue;
        seen.add(next);
        previous.set(next, { node: at, label: edge.label });
        if (next.startsWith('ground:')) {
          const path: string[] = [];
          for (let n = next; n !== start;) {
            const p = previous.get(n)!;
            path.unshift(`${p.label} → ${this.describe(n).title}`);
            n = p.node;
          }
          found.push({ groundId: Number(next.split(':')[1]), path });
        } else if (next.startsWith('splice:')) {
          queue.push(next);
        }
      }
    }
    return found;
  }
}
