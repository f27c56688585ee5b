import type { BenchTick } from './bench.schema.ts';

export const TEST_PHASES = ['unplugged', 'powered', 'first_start'] as const;
export type TestPhase = (typeof TEST_PHASES)[number];

/** Each reading is typed in one unit; 'check' steps are a pass or a fail the technician gives. */
export type TestUnit = 'Ω' | 'MΩ' | 'V' | 'check';

export interface TestLimit {
  min: number | null;
  max: number | null;
  /** Judged against the recorded battery voltage instead of a fixed figure. */
  withinOfBatteryV?: number;
}

export interface TestStep {
  /** The bench record key the result is stored under ("pin:E2-2" for a wire's continuity). */
  key: string;
  phase: TestPhase;
  subject: string;
  what: string;
  unit: TestUnit;
  expected: number | null;
  expectedText: string;
  limit: TestLimit | null;
  limitText: string;
  /** Where the limit comes from: a standard, or "common practice, no source". */
  source: string;
}

export interface TestPlan {
  systemVoltage: number;
  benchTempC: number;
  steps: TestStep[];
}

export type TestVerdict = 'pass' | 'fail' | 'unknown';

export interface TestResult {
  /** Every tick of the record: a wire's continuity shares its record with the checklist item. */
  ticks: Partial<Record<BenchTick, boolean>>;
  reading: number | null;
  passed: boolean;
  failed: boolean;
  note: string;
  verdict: TestVerdict;
  recordedBy: string;
  recordedAt: string;
  version: number;
}

export interface TestPlanResponse {
  revision: { number: number; hash: string; current: boolean };
  plan: TestPlan;
  results: Record<string, TestResult>;
}
