import { z } from 'zod';
import { IdParam, optionalText } from './common.schema.ts';
import type { SnapshotPin } from './snapshot.schema.ts';

export const BenchPinParams = z.strictObject({ id: IdParam, number: IdParam, pinId: IdParam });
export type BenchPinParams = z.output<typeof BenchPinParams>;

export const BenchRecordRequest = z.strictObject({
  done: z.boolean(),
  tested: z.boolean(),
  /** Continuity reading across the finished circuit, ohms; null when not measured. */
  resistanceOhm: z.number().min(0).max(1_000_000).nullable(),
  note: optionalText(500),
  /** The record's version as read; null when the pin has no record yet. */
  version: z.number().int().min(0).nullable(),
});
export type BenchRecordRequest = z.infer<typeof BenchRecordRequest>;

export interface BenchRecord {
  pinId: number;
  done: boolean;
  tested: boolean;
  resistanceOhm: number | null;
  note: string;
  recordedBy: string;
  recordedAt: string;
  version: number;
}

export interface BenchItem {
  pin: SnapshotPin;
  name: string;
  destinationLabel: string;
  /** Resistance of the wire alone from its size and run length (IACS copper, 20 °C), if both are known. */
  expectedOhm: number | null;
  record: BenchRecord | null;
}

export interface BenchSheet {
  revision: { number: number; hash: string; signedAt: string; reviewedBy: string } | null;
  items: BenchItem[];
  progress: { total: number; done: number; tested: number };
}
