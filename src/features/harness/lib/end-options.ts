import {
  GROUND_LOCATION_LABELS,
  RELAY_TERMINALS,
  FUSE_TERMINALS,
  SOURCES,
  SOURCE_LABELS,
  type Box,
  type GroundPoint,
  type Splice,
  type WireEnd,
} from '#shared/schemas/harness.schema.ts';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';

/** What a wire end can be fastened to, as the type-ahead lists it. */
export interface EndOption {
  key: string;
  end: WireEnd;
  /** The short name a builder reads on the bench: "E2-10", "S-03", "R4 relay · 87". */
  label: string;
  /** What it is: the pin's function, the ground's location. */
  detail: string;
  /** Lower-case text the typed words are matched against. */
  search: string;
}

/** Everything of the conversion an end can name; the pin map's pins come from the route. */
export interface HarnessParts {
  pins: Pin[];
  connectors: Connector[];
  splices: Splice[];
  groundPoints: GroundPoint[];
  boxes: Box[];
}

/** One key per end: two ends with the same key are fastened to the same place. */
export function endKey(end: WireEnd): string {
  switch (end.kind) {
    case 'pin':
    case 'splice':
    case 'ground':
      return `${end.kind}:${end.refId}`;
    case 'relay':
    case 'fuse':
      return `${end.kind}:${end.refId}:${end.terminal}`;
    case 'source':
      return `source:${end.source}`;
    case 'unresolved':
      return `unresolved:${end.text}`;
  }
}

const option = (end: WireEnd, label: string, detail = ''): EndOption => ({
  key: endKey(end),
  end,
  label,
  detail,
  search: `${label} ${detail}`.toLowerCase(),
});

/** Every place of the conversion a wire end can go, pins first in connector order. */
export function endOptions(parts: HarnessParts): EndOption[] {
  const connectorLabel = new Map(parts.connectors.map((c) => [c.id, c.label]));
  const connectorOrder = new Map(parts.connectors.map((c, i) => [c.id, i]));
  const pins = [...parts.pins].sort(
    (a, b) =>
      (connectorOrder.get(a.connectorId) ?? 0) - (connectorOrder.get(b.connectorId) ?? 0) ||
      a.position - b.position,
  );
  const list: EndOption[] = [];
  for (const p of pins) {
    const connector = connectorLabel.get(p.connectorId) ?? '?';
    list.push(option({ kind: 'pin', refId: p.id }, `${connector}-${p.cavity}`, p.function));
  }
  for (const s of parts.splices)
    list.push(option({ kind: 'splice', refId: s.id }, s.label, 'splice'));
  for (const g of parts.groundPoints) {
    const where = GROUND_LOCATION_LABELS[g.location].toLowerCase();
    list.push(option({ kind: 'ground', refId: g.id }, `${g.label} ${where}`, 'ground point'));
  }
  for (const box of parts.boxes) {
    for (const p of box.positions) {
      if (p.kind === 'relay') {
        for (const terminal of RELAY_TERMINALS) {
          list.push(
            option(
              { kind: 'relay', refId: p.id, terminal },
              `${p.label} relay · ${terminal}`,
              box.label,
            ),
          );
        }
      } else {
        for (const terminal of FUSE_TERMINALS) {
          list.push(
            option(
              { kind: 'fuse', refId: p.id, terminal },
              `${p.label} fuse · ${terminal}`,
              `${p.ratingA} A · ${box.label}`,
            ),
          );
        }
      }
    }
  }
  for (const s of SOURCES)
    list.push(option({ kind: 'source', source: s }, SOURCE_LABELS[s], 'source'));
  return list;
}

/** The words a builder reads for an end, from the options listed (or a plain fallback). */
export function endText(end: WireEnd, byKey: ReadonlyMap<string, EndOption>): string {
  if (end.kind === 'unresolved') return `Not yet fastened: ${end.text}`;
  const found = byKey.get(endKey(end));
  if (!found) return `${end.kind} (not found)`;
  return found.detail && end.kind === 'pin' ? `${found.label} ${found.detail}` : found.label;
}

/**
 * The options matching what was typed: every word must appear; a label starting with the text
 * comes first. The last choice keeps the typed text as a loose end.
 */
export function matchEnds(options: readonly EndOption[], typed: string, limit = 40): EndOption[] {
  const text = typed.trim().toLowerCase();
  const words = text.split(/\s+/).filter(Boolean);
  const hits = words.length
    ? options.filter((o) => words.every((w) => o.search.includes(w)))
    : options.slice();
  const starts = (o: EndOption) => (o.label.toLowerCase().startsWith(text) ? 0 : 1);
  const ranked = hits
    .map((o, i) => ({ o, i }))
    .sort((a, b) => starts(a.o) - starts(b.o) || a.i - b.i)
    .map((x) => x.o)
    .slice(0, limit);
  if (typed.trim()) {
    const end: WireEnd = { kind: 'unresolved', text: typed.trim() };
    ranked.push({
      key: endKey(end),
      end,
      label: `Not yet fastened: ${typed.trim()}`,
      detail: '',
      search: '',
    });
  }
  return ranked;
}
