import type { ColumnMapping } from '#shared/schemas/imports.schema.ts';

export interface ImportInput {
  file: File;
  /** The column choices to use; the server picks (saved or by header name) when omitted. */
  mapping?: ColumnMapping[];
  /** Preview only: which page of the file's lines to show, from 1. */
  page?: number;
  /** Applying only: the person confirmed the cavities the file adds to a connector. */
  grow?: boolean;
  /** Applying only: the preview being applied, sent instead of the file while the server keeps it. */
  previewId?: string;
}

/** The multipart body: the file in `file`, the choices as JSON {header: field} in `mapping`. */
export function importForm({ file, mapping }: ImportInput): FormData {
  const form = new FormData();
  if (mapping) {
    form.append(
      'mapping',
      JSON.stringify(Object.fromEntries(mapping.map((m) => [m.header, m.target]))),
    );
  }
  form.append('file', file, file.name);
  return form;
}
