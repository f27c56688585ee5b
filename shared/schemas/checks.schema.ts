import type { SourceRef } from '../domain/electrical/sources.ts';

export const SEVERITIES = ['error', 'warning', 'note'] as const;
export type Severity = (typeof SEVERITIES)[number];

export const CHECK_RULES = [
  'unfused_feed',
  'fuse_protects_wire',
  'load_within_fuse',
  'fuse_larger_than_load_needs',
  'feed_without_loads',
  'relay_contact_load',
  'voltage_drop',
  'joined_wire_smaller_than_fuse_allows',
  'joined_wire_size_missing',
  'power_pin_unfused',
  'sensor_ground_extra_ground',
  'undecided_pins',
  'destination_used_twice',
  'fuse_placement',
  'relay_coil_driver',
  'ecu_output_overload',
  'ground_pin_removed',
  'wire_end_unresolved',
  'cavity_two_wires',
  'splice_wire_smaller_than_fuse',
  'pulse_no_pull_up',
  'pulse_wave_mismatch',
  'pulse_ratio',
  'can_termination',
  'shield_grounded_far_end',
  'reference_feeds_vehicle',
  'regulated_circuit_removed',
  'fuel_pump_control',
  'fuel_pump_cutoff',
  'coil_without_supply',
  'lamp_output_led',
  'main_relay_plain_ignition',
  'power_ground_unreached',
  'ground_strap_small',
  'sensor_ground_to_power_ground',
  'can_pair_untwisted',
  'can_stub_long',
  'diagnostic_pin_wrong_line',
  'crank_cam_unprotected',
  'ecu_power_not_from_main_relay',
  'pedal_track_removed',
] as const;
export type CheckRule = (typeof CHECK_RULES)[number];

/** One number (or word) of a finding's working, with its unit. */
export interface FindingValue {
  label: string;
  value: number | string | boolean | null;
  unit?: string;
}

export interface Finding {
  /** Stable across runs for the same rule and subject. */
  id: string;
  rule: CheckRule;
  severity: Severity;
  subject: { pinIds?: number[]; feedId?: number };
  title: string;
  message: string;
  values: Record<string, FindingValue>;
  /** The working, one line per step, with the numbers put in. */
  working: string[];
  /** The published sources (or "common practice, no source"), as one line. */
  source: string;
  sources: SourceRef[];
}

export interface CheckReport {
  findings: Finding[];
  counts: Record<Severity, number>;
  checkedAt: string;
}
