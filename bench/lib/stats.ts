/** Several rounds of one figure: the median with the lowest and highest beside it. */
export interface Spread {
  median: number;
  min: number;
  max: number;
  values: number[];
}

export function spread(values: number[]): Spread {
  if (values.length === 0) throw new Error('no values');
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  const median = sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
  return { median, min: sorted[0]!, max: sorted.at(-1)!, values };
}

/** Round by round ratios (product ÷ baseline of the same round), as a spread. */
export function ratios(product: number[], baseline: number[]): Spread {
  return spread(product.map((p, i) => p / baseline[i]!));
}

export function num(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const abs = Math.abs(value);
  if (abs >= 100) return value.toFixed(0);
  if (abs >= 10) return value.toFixed(1);
  if (abs >= 1) return value.toFixed(2);
  return value.toFixed(3);
}

/** "0.62× [0.55–0.70]" */
export function times(s: Spread): string {
  return `${num(s.median)}× [${num(s.min)}–${num(s.max)}]`;
}

/** "43 ms [40–51]" */
export function withUnit(s: Spread, unit: string): string {
  return `${num(s.median)} ${unit} [${num(s.min)}–${num(s.max)}]`;
}

/**
 * Runs the product and its baseline `rounds` times each, alternating which goes first so that
 * neither always gets the quieter moment of a busy machine; `after` runs at the end of each round.
 */
export async function alternate<A, B>(
  rounds: number,
  product: () => Promise<A>,
  baseline: () => Promise<B>,
  after?: () => void,
): Promise<{ product: A[]; baseline: B[] }> {
  const out = { product: [] as A[], baseline: [] as B[] };
  for (let r = 0; r < rounds; r++) {
    if (r % 2 === 0) {
      out.product.push(await product());
      out.baseline.push(await baseline());
    } else {
      out.baseline.push(await baseline());
      out.product.push(await product());
    }
    after?.();
  }
  return out;
}
