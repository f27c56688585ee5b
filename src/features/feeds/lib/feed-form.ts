/**
 * The feed form's values (text as typed) and their mapping to and from the API's shapes. Pure, so
 * the mapping is unit-tested in node.
 */
import { DEFAULT_CONNECTIONS } from '#shared/domain/electrical/drop-budget.ts';
import { DEFAULT_FUSE_TYPE } from '#shared/domain/electrical/fuses.ts';
import { editableWireSize, parseWireSize } from '#shared/domain/wire-sizes.ts';
import { z } from 'zod';
import {
  CreateFeedRequest,
  type DropClass,
  type Feed,
  type FeedSource,
  type FuseType,
  type LoadKind,
  type ReturnPath,
  type WireZone,
} from '#shared/schemas/feeds.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';

export interface LoadRow {
  /** React key: the load's id once saved, a counter before. */
  key: string;
  pinId: string;
  name: string;
  currentA: string;
  continuous: boolean;
  kind: LoadKind;
}

export interface FeedFormValues {
  name: string;
  source: FeedSource;
  sourceFeedId: string;
  /** A rating; NO_FUSE, chosen on purpose; or '' before anything is chosen. */
  fuseA: string;
  fuseType: FuseType;
  /** Wire between the source and the fuse, mm; '' when not measured yet. */
  unfusedLengthMm: string;
  fuseSheathed: boolean;
  hasRelay: boolean;
  relayContactRatingA: string;
  relayCoilCurrentA: string;
  /** '' when the coil current is given instead. */
  relayCoilResistanceOhm: string;
  relayCoilPinId: string;
  /** As typed, in the workshop's unit (or with an explicit "mm²" / "AWG"). */
  wireSize: string;
  insulationRatingC: string;
  lengthM: string;
  zone: WireZone;
  bundled: string;
  returnPath: ReturnPath;
  colour: string;
  /** Crimped terminals and splices along the run. */
  connections: string;
  loads: LoadRow[];
  dropClass: DropClass;
  /** '' uses the class's limit. */
  dropLimitPct: string;
  notes: string;
}

/** Field errors keyed by the request's path, as the server names them ("wire.sizeMm2", "loads.0.currentA"). */
export type FieldErrors = Record<string, string>;

/** The form's word for a feed deliberately left without a fuse (a fire risk the checks report). */
export const NO_FUSE = 'none';

const FORM_FIELDS =
  /^(name|source|sourceFeedId|fuseA|fuseType|unfusedLengthMm|fuseSheathed|relay\.(contactRatingA|coilCurrentA|coilResistanceOhm|coilPinId)|wire\.(sizeMm2|insulationRatingC|lengthM|zone|bundled|returnPath|colour|connections)|loads(\.\d+\.(name|pinId|currentA|kind))?|dropClass|dropLimitPct|notes)$/;

/** Whether the form shows an error under this request path; others are told in words above Save. */
export function isFormField(path: string): boolean {
  return FORM_FIELDS.test(path);
}

let loadCounter = 0;
export function newLoadRow(): LoadRow {
  loadCounter += 1;
  return {
    key: `new-${loadCounter}`,
    pinId: '',
    name: '',
    currentA: '',
    continuous: true,
    kind: 'resistive',
  };
}

export function emptyFeedForm(defaults: { insulationRatingC: number }): FeedFormValues {
  return {
    name: '',
    source: 'battery',
    sourceFeedId: '',
    fuseA: '',
    fuseType: DEFAULT_FUSE_TYPE,
    unfusedLengthMm: '',
    fuseSheathed: false,
    hasRelay: false,
    relayContactRatingA: '30',
    relayCoilCurrentA: '0.15',
    relayCoilResistanceOhm: '',
    relayCoilPinId: '',
    wireSize: '',
    insulationRatingC: String(defaults.insulationRatingC),
    lengthM: '',
    zone: 'cabin',
    bundled: '1',
    returnPath: 'wire',
    colour: '',
    connections: String(DEFAULT_CONNECTIONS),
    loads: [newLoadRow()],
    dropClass: 'general',
    dropLimitPct: '',
    notes: '',
  };
}

export function feedToForm(feed: Feed, unit: SizeUnit): FeedFormValues {
  return {
    name: feed.name,
    source: feed.source,
    sourceFeedId: feed.sourceFeedId == null ? '' : String(feed.sourceFeedId),
    fuseA: feed.fuseA == null ? NO_FUSE : String(feed.fuseA),
    fuseType: feed.fuseType ?? DEFAULT_FUSE_TYPE,
    unfusedLengthMm: feed.unfusedLengthMm == null ? '' : String(feed.unfusedLengthMm),
    fuseSheathed: feed.fuseSheathed ?? false,
    hasRelay: feed.relay !== null,
    relayContactRatingA: feed.relay ? String(feed.relay.contactRatingA) : '30',
    relayCoilCurrentA: feed.relay ? String(feed.relay.coilCurrentA) : '0.15',
    relayCoilResistanceOhm:
      feed.relay?.coilResistanceOhm == null ? '' : String(feed.relay.coilResistanceOhm),
    relayCoilPinId: feed.relay?.coilPinId == null ? '' : String(feed.relay.coilPinId),
    wireSize: editableWireSize(feed.wire.sizeMm2, unit),
    insulationRatingC: String(feed.wire.insulationRatingC),
    lengthM: String(feed.wire.lengthM),
    zone: feed.wire.zone,
    bundled: String(feed.wire.bundled),
    returnPath: feed.wire.returnPath,
    colour: feed.wire.colour,
    connections: String(feed.wire.connections ?? DEFAULT_CONNECTIONS),
    loads: feed.loads.map((l) => ({
      key: `load-${l.id}`,
      pinId: l.pinId == null ? '' : String(l.pinId),
      name: l.name,
      currentA: String(l.currentA),
      continuous: l.continuous,
      kind: l.kind ?? 'resistive',
    })),
    dropClass: feed.dropClass,
    dropLimitPct: feed.dropLimitPct == null ? '' : String(feed.dropLimitPct),
    notes: feed.notes,
  };
}

type NumberRead = { ok: true; value: number | null } | { ok: false; error: string };

/** A number as typed: "" is null, a decimal comma is accepted. */
export function readNumber(text: string): NumberRead {
  const t = text.trim().replace(',', '.');
  if (t === '') return { ok: true, value: null };
  const n = Number(t);
  return Number.isFinite(n) ? { ok: true, value: n } : { ok: false, error: 'must be a number' };
}

export const readId = (text: string): number | null => (text === '' ? null : Number(text));

export type FormToRequest =
  { ok: true; request: CreateFeedRequest } | { ok: false; errors: FieldErrors };

/**
 * Reads the form into a create request, checked by the same zod schema the server uses. Errors are
 * keyed by the request's path so the server's 400 lands beside the same fields.
 */
export function formToRequest(values: FeedFormValues, unit: SizeUnit): FormToRequest {
  const errors: FieldErrors = {};
  const number = (key: string, text: string, required: boolean): number | null => {
    const read = readNumber(text);
    if (!read.ok) {
      errors[key] = read.error;
      return null;
    }
    if (read.value === null && required) {
      errors[key] = key === 'fuseA' ? 'choose a rating, or “No fuse”' : 'is required';
    }
    return read.value;
  };

  const size = parseWireSize(values.wireSize, unit);
  let sizeMm2: number | null = null;
  if (!size.ok) errors['wire.sizeMm2'] = size.error;
  else if (size.areaMm2 === null) errors['wire.sizeMm2'] = 'is required';
  else sizeMm2 = size.areaMm2;

  const candidate = {
    name: values.name,
    source: values.source,
    sourceFeedId: values.source === 'relay_output' ? readId(values.sourceFeedId) : null,
    fuseA: values.fuseA === NO_FUSE ? null : number('fuseA', values.fuseA, true),
    fuseType: values.fuseType,
    unfusedLengthMm: number('unfusedLengthMm', values.unfusedLengthMm, false),
    fuseSheathed: values.fuseSheathed,
    relay: values.hasRelay
      ? {
          contactRatingA: number('relay.contactRatingA', values.relayContactRatingA, true),
          coilCurrentA: number('relay.coilCurrentA', values.relayCoilCurrentA, true),
          coilResistanceOhm: number(
            'relay.coilResistanceOhm',
            values.relayCoilResistanceOhm,
            false,
          ),
          coilPinId: readId(values.relayCoilPinId),
        }
      : null,
    wire: {
      sizeMm2,
      insulationRatingC: Number(values.insulationRatingC),
      lengthM: number('wire.lengthM', values.lengthM, true),
      zone: values.zone,
      bundled: number('wire.bundled', values.bundled, true),
      returnPath: values.returnPath,
      colour: values.colour,
      connections: number('wire.connections', values.connections, true) ?? undefined,
    },
    loads: values.loads.map((l, i) => {
      if (l.pinId === '' && l.name.trim() === '') {
        errors[`loads.${i}.name`] = 'name the device or pick a pin';
      }
      return {
        pinId: readId(l.pinId),
        name: l.name,
        currentA: number(`loads.${i}.currentA`, l.currentA, true),
        continuous: l.continuous,
        kind: l.kind,
      };
    }),
    dropClass: values.dropClass,
    dropLimitPct: number('dropLimitPct', values.dropLimitPct, false),
    notes: values.notes,
  };

  const parsed = CreateFeedRequest.safeParse(candidate);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = issue.path.length ? issue.path.join('.') : '(form)';
      // Our own message (e.g. "is required") says more than the schema's type error.
      errors[key] ??= issue.message;
    }
  }
  if (Object.keys(errors).length || !parsed.success) return { ok: false, errors };
  return { ok: true, request: parsed.data };
}

/**
 * The feed form's schema for the form library's zod resolver: the values as typed, read into a
 * create request and checked by CreateFeedRequest, the server's own schema. A refusal is marked at
 * the request's path ("wire.sizeMm2", "loads.0.currentA"), where the server's 400 lands too.
 */
export function feedFormSchema(unit: SizeUnit) {
  return z.custom<FeedFormValues>().transform((values, ctx) => {
    const read = formToRequest(values, unit);
    if (read.ok) return read.request;
    for (const [key, message] of Object.entries(read.errors)) {
      const path =
        key === '(form)' ? [] : key.split('.').map((p) => (/^\d+$/.test(p) ? Number(p) : p));
      ctx.addIssue({ code: 'custom', message, path });
    }
    return z.NEVER;
  });
}
