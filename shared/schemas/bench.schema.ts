import { z } from 'zod';
import type { BenchPlanItem, Rework } from '../domain/bench.ts';
import { IdParam, noteText } from './common.schema.ts';

/**
 * The ticks the bench can record. Each item offers only those that make sense for it: a de-pinned
 * cavity gets "done" and "sealed", a cut wire "done" and "insulated", never a reading.
 */
export const BENCH_TICKS = [
  'done',
  'sealed',
  'insulated',
  'fuse',
  'relay',
  'labelled',
  'torqued',
  'tested',
  'passed',
  'failed',
] as const;
export type BenchTick = (typeof BENCH_TICKS)[number];
export interface BenchTickDef {
  key: BenchTick;
  label: string;
}

/** An item of the checklist or a step of the test plan: "pin:E1-12", "feed:3", "test:short:pin:E1-12". */
export const BenchKey = z
  .string()
  .min(3)
  .max(200)
  .regex(/^[a-z]+:\S.*$/, 'must be a bench item key such as pin:E1-12');

export const BenchItemParams = z.strictObject({ id: IdParam, number: IdParam, key: BenchKey });
export type BenchItemParams = z.output<typeof BenchItemParams>;

export const BenchRecordRequest = z.strictObject({
  ticks: z.partialRecord(z.enum(BENCH_TICKS), z.boolean()),
  /** The reading in the unit the item or test step asks for; null when not measured. */
  reading: z.number().min(-1_000_000).max(1_000_000).nullable(),
  note: noteText(500),
  /** The record's version as read; null when the item has no record yet. */
  version: z.number().int().min(0).nullable(),
});
export type BenchRecordRequest = z.infer<typeof BenchRecordRequest>;

export interface BenchRecord {
  key: string;
  ticks: Partial<Record<BenchTick, boolean>>;
  reading: number | null;
  note: string;
  recordedBy: string;
  recordedAt: string;
  version: number;
  /** The revision this record was first made on, when it was carried over unchanged. */
  carriedFrom: number | null;
  /** Work done on an earlier revision that the change makes obsolete. */
  rework: Rework | null;
}

export interface BenchPhoto {
  id: number;
  fileName: string;
  takenBy: string | null;
  createdAt: string;
}

/** A checklist item as the API sends it: the plan item with its record. */
export type BenchItem = Omit<BenchPlanItem, 'content'> & { record: BenchRecord | null };

export interface BenchSheet {
  revision: {
    number: number;
    hash: string;
    signedAt: string;
    reviewedBy: string;
    /** False for an older revision: readable, no longer recorded against. */
    current: boolean;
  } | null;
  /** Changed items with obsolete work, first; then removed items to take out. */
  rework: BenchItem[];
  removed: Array<{ key: string; rework: Rework; record: BenchRecord }>;
  items: BenchItem[];
  progress: { total: number; done: number; tested: number; rework: number };
  /** Photos taken at the bench, by item key. */
  photos: Record<string, BenchPhoto[]>;
}

/** Shown on the conversions list: what the bench has to know. */
export interface BenchNotice {
  revisionNumber: number;
  signedAt: string;
  /** Items under rework or to take out, not yet re-done. */
  reworkOpen: number;
  /** Items of the signed-off plan, and how many are done and how many tested. */
  progress: { total: number; done: number; tested: number };
}
