/**
 * A circuit laid out for drawing, by dagre's layered graph layout, and drawn as SVG. The worksheet
 * draws the same layout with pdfkit, so the screen and the paper show one drawing.
 */
import dagre from '@dagrejs/dagre';
import type { Circuit, CircuitNode, NodeKind } from './circuit-graph.ts';

export interface PlacedNode extends CircuitNode {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface PlacedEdge {
  label: string;
  points: Array<{ x: number; y: number }>;
  /** Where the label sits. */
  labelAt: { x: number; y: number };
}

export interface CircuitLayout {
  title: string;
  nodes: PlacedNode[];
  edges: PlacedEdge[];
  width: number;
  height: number;
}

/** Font size the layout is measured for; a character is taken as 0.6 of it wide. */
export const DIAGRAM_FONT_PX = 11;
const CHAR_W = DIAGRAM_FONT_PX * 0.6;
const LINE_H = DIAGRAM_FONT_PX * 1.35;
const PAD = 8;

/** Left to right in the order current flows: source, fuse, relay, wires, loads, ground. */
const RANK: Record<NodeKind, number> = {
  source: 0,
  fuse: 1,
  relay: 2,
  splice: 3,
  pin: 4,
  unresolved: 4,
  ground: 5,
};

export function layoutCircuit(circuit: Circuit): CircuitLayout {
  const g = new dagre.graphlib.Graph({ multigraph: true });
  g.setGraph({ rankdir: 'LR', nodesep: 18, ranksep: 70, edgesep: 12, marginx: 12, marginy: 12 });
  g.setDefaultEdgeLabel(() => ({}));
  for (const n of circuit.nodes) {
    const longest = Math.max(n.title.length, ...n.lines.map((l) => l.length));
    g.setNode(n.id, {
      width: Math.min(240, Math.max(70, longest * CHAR_W + 2 * PAD)),
      height: (1 + n.lines.length) * LINE_H + 2 * PAD,
    });
  }
  circuit.edges.forEach((e, i) => {
    // Point each edge the way current flows, so the layers read source → ground.
    const [from, to] = RANK[kindOf(e.from)] <= RANK[kindOf(e.to)] ? [e.from, e.to] : [e.to, e.from];
    g.setEdge(
      from,
      to,
      { label: e.label, width: e.label.length * CHAR_W, height: LINE_H, labelpos: 'c' },
      `e${i}`,
    );
  });
  dagre.layout(g);
  const nodes = circuit.nodes.map((n) => {
    const placed = g.node(n.id);
    return { ...n, x: placed.x, y: placed.y, width: placed.width, height: placed.height };
  });
  const edges = g.edges().map((ref) => {
    const e = g.edge(ref) as {
      label: string;
      points: Array<{ x: number; y: number }>;
      x: number;
      y: number;
    };
    return { label: e.label, points: e.points, labelAt: { x: e.x, y: e.y } };
  });
  const graph = g.graph() as { width?: number; height?: number };
  return {
    title: circuit.title,
    nodes,
    edges,
    width: Math.ceil(graph.width ?? 200),
    height: Math.ceil(graph.height ?? 100),
  };
}

function kindOf(nodeId: string): NodeKind {
  return nodeId.split(':')[0] as NodeKind;
}

const escapeXml = (s: string) =>
  s.replace(
    /[<>&"']/g,
    (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

/**
 * Node outlines that tell the kinds apart in black and white: a heavy box for a source, double for
 * a fuse, dashed for a relay, round for a splice, a bar below for a ground point, dotted for an end
 * not yet fastened.
 */
const OUTLINE: Record<NodeKind, string> = {
  source: 'stroke-width="2.5"',
  fuse: 'stroke-width="1.2"',
  relay: 'stroke-width="1.2" stroke-dasharray="6 3"',
  pin: 'stroke-width="1"',
  splice: 'stroke-width="1.2"',
  ground: 'stroke-width="1.2"',
  unresolved: 'stroke-width="1" stroke-dasharray="2 2"',
};

/** The layout as a standalone SVG document: print-ready, legible in black and white. */
export function circuitSvg(layout: CircuitLayout): string {
  const titleH = 28;
  const width = Math.max(layout.width, layout.title.length * CHAR_W * 1.2 + 24);
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${Math.ceil(width)} ${layout.height + titleH}" width="${Math.ceil(width)}" height="${layout.height + titleH}" font-family="sans-serif" font-size="${DIAGRAM_FONT_PX}" role="img" aria-label="${escapeXml(layout.title)}">`,
    `<title>${escapeXml(layout.title)}</title>`,
    `<rect width="100%" height="100%" fill="#fff"/>`,
    `<text x="12" y="18" font-size="${DIAGRAM_FONT_PX + 3}" font-weight="bold">${escapeXml(layout.title)}</text>`,
    `<g transform="translate(0 ${titleH})" fill="none" stroke="#111">`,
  ];
  for (const e of layout.edges) {
    const d = e.points
      .map((p, i) => `${i ? 'L' : 'M'}${p.x.toFixed(1)} ${p.y.toFixed(1)}`)
      .join(' ');
    out.push(`<path d="${d}" stroke-width="1.4"/>`);
    out.push(
      `<text x="${e.labelAt.x.toFixed(1)}" y="${(e.labelAt.y - 3).toFixed(1)}" text-anchor="middle" fill="#111" stroke="#fff" stroke-width="3" paint-order="stroke" class="wire-label">${escapeXml(e.label)}</text>`,
    );
  }
  for (const n of layout.nodes) {
    const x = n.x - n.width / 2;
    const y = n.y - n.height / 2;
    const radius = n.kind === 'splice' ? n.height / 2 : 3;
    out.push(
      `<rect x="${x.toFixed(1)}" y="${y.toFixed(1)}" width="${n.width.toFixed(1)}" height="${n.height.toFixed(1)}" rx="${radius.toFixed(1)}" fill="#fff" ${OUTLINE[n.kind]}/>`,
    );
    if (n.kind === 'fuse') {
      out.push(
        `<rect x="${(x + 3).toFixed(1)}" y="${(y + 3).toFixed(1)}" width="${(n.width - 6).toFixed(1)}" height="${(n.height - 6).toFixed(1)}" rx="2" stroke-width="0.8"/>`,
      );
    }
    if (n.kind === 'ground') {
      const cx = n.x;
      const by = y + n.height;
      out.push(
        `<path d="M${cx - 14} ${by + 4}h28M${cx - 9} ${by + 8}h18M${cx - 4} ${by + 12}h8" stroke-width="1.4"/>`,
      );
    }
    const lines = [n.title, ...n.lines];
    lines.forEach((line, i) => {
      out.push(
        `<text x="${n.x.toFixed(1)}" y="${(y + PAD + (i + 0.8) * LINE_H).toFixed(1)}" text-anchor="middle" fill="#111" stroke="none"${i === 0 ? ' font-weight="bold"' : ''}>${escapeXml(line)}</text>`,
      );
    });
  }
  out.push('</g></svg>');
  return out.join('\n');
}
