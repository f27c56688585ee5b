/**
 * Input guards for the calculations. Requests are validated by their zod schemas before they get
 * here; these catch a programming slip (NaN, a negative length) before it becomes a
 * plausible-looking but wrong number on a worksheet.
 */
export function requirePositive(name: string, value: number): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a positive number, got ${value}`);
  }
}

export function requireNonNegative(name: string, value: number): void {
  if (!Number.isFinite(value) || value < 0) {
    throw new RangeError(`${name} must be zero or more, got ${value}`);
  }
}

export function requireFinite(name: string, value: number): void {
  if (!Number.isFinite(value)) throw new RangeError(`${name} must be a number, got ${value}`);
}

/** Comparisons of computed values against a limit forgive floating-point dust, never more. */
export const FLOAT_SLACK = 1e-9;
