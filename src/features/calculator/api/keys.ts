import type { CalcRequestInput } from '#shared/schemas/calc.schema.ts';

/** Query keys for the stateless calculator: the whole request is the key. */
export const calcKeys = {
  all: ['calc'] as const,
  runs: () => [...calcKeys.all, 'run'] as const,
  run: (input: CalcRequestInput) => [...calcKeys.runs(), input] as const,
};
