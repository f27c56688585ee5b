import { useState } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useImportWires, type WireImportResult } from '../api/import-wires.ts';

/**
 * The wire list from a CSV file: a dry run first lists every problem by row and column; the file
 * is applied only when it has none, all of it or nothing.
 */
export function WireImport({
  conversionId,
  onClose,
}: {
  conversionId: number;
  onClose: () => void;
}) {
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<WireImportResult | null>(null);
  const [applied, setApplied] = useState<WireImportResult | null>(null);
  const run = useImportWires(conversionId);

  const check = (f: File) =>
    run.mutate(
      { file: f, dryRun: true },
      {
        onSuccess: (r) => {
          setPreview(r);
          setApplied(null);
        },
      },
    );
  const apply = () =>
    file &&
    run.mutate(
      { file, dryRun: false },
      { onSuccess: (r) => (r.errors.length ? setPreview(r) : setApplied(r)) },
    );

  return (
    <section
      aria-label="Import wires from CSV"
      className="grid gap-3 rounded-lg border border-rule bg-paper-raised p-4"
    >
      <h2 className="font-semibold">Import wires from CSV</h2>
      <p className="text-sm text-ink-soft">
        Columns as in the export: label, colour, size_mm2, length_m, zone, end_a, end_b, notes. Ends
        are written as on the bench (E2-10, S-03, G-2, R4:87, F4:out, battery). A row whose label
        exists changes that wire; any problem and nothing is written.
      </p>
      <label className="text-sm font-medium">
        CSV file
        <input
          type="file"
          accept=".csv,text/csv"
          className="ml-3 text-sm"
          onChange={(e) => {
            const f = e.target.files?.[0] ?? null;
            setFile(f);
            setPreview(null);
            setApplied(null);
            if (f) check(f);
          }}
        />
      </label>
      {run.isError ? (
        <Notice tone="fault" title="The file could not be read">
          {run.error.message}
        </Notice>
      ) : null}
      {preview && preview.errors.length > 0 ? (
        <div className="grid gap-2">
          <Notice
            tone="fault"
            title={`${preview.errors.length} problem(s) in ${preview.rows} row(s); nothing was written`}
          />
          <table aria-label="Problems in the file" className="w-full text-sm">
            <thead>
              <tr className="border-b border-rule text-left">
                <th className="px-2 py-1">Row</th>
                <th className="px-2 py-1">Column</th>
                <th className="px-2 py-1">Problem</th>
              </tr>
            </thead>
            <tbody>
              {preview.errors.map((e, i) => (
                <tr key={i} className="border-b border-rule/60">
                  <td className="px-2 py-1 font-mono">{e.row}</td>
                  <td className="px-2 py-1 font-mono">{e.column}</td>
                  <td className="px-2 py-1">{e.message}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {preview && preview.errors.length === 0 && !applied ? (
        <Notice tone="sound" title={`${preview.rows} row(s) read without a problem`}>
          Nothing is written until you apply the file.
        </Notice>
      ) : null}
      {applied ? <Notice tone="sound" title={`Imported ${applied.imported} wire(s)`} /> : null}
      <div className="flex gap-2">
        <Button
          variant="primary"
          disabled={!preview || preview.errors.length > 0 || applied !== null}
          busy={run.isPending}
          onClick={apply}
        >
          Apply the file
        </Button>
        <Button variant="quiet" onClick={onClose}>
          Close
        </Button>
      </div>
    </section>
  );
}
