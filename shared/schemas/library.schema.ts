import { z } from 'zod';
import type { PinValues, TemplatePinKey } from '../domain/fields/pin-fields.ts';
import { noteText, requiredText } from './common.schema.ts';
import { CONNECTOR_SIDES, type ConnectorSide } from './pin-map.schema.ts';

/** Saves one connector's pinout (cavities, layout and each pin's wire and decision) for reuse. */
export const SaveTemplateRequest = z.strictObject({
  connectorId: z.number().int().positive(),
  name: requiredText(120),
  description: noteText(2000).optional(),
});
export type SaveTemplateRequest = z.infer<typeof SaveTemplateRequest>;

/** Starts a connector of a conversion from a template, pins and all. */
export const ConnectorFromTemplateRequest = z.strictObject({
  templateId: z.number().int().positive(),
  label: requiredText(40),
  /** The template's side when omitted. */
  side: z.enum(CONNECTOR_SIDES).optional(),
});
export type ConnectorFromTemplateRequest = z.infer<typeof ConnectorFromTemplateRequest>;

/** A cavity of a template with the pin fields a template keeps (the pin field table says which). */
export type TemplatePin = { cavity: string; position: number } & Pick<PinValues, TemplatePinKey>;

export interface PinoutTemplate {
  id: number;
  name: string;
  side: ConnectorSide;
  description: string;
  cavityCount: number;
  rows: number;
  columns: number;
  /** Built-in templates come with Loomwright, are the same in every workshop and are read-only. */
  builtIn: boolean;
  createdBy: string | null;
  createdAt: string;
}

export interface PinoutTemplateDetail extends PinoutTemplate {
  pins: TemplatePin[];
}
