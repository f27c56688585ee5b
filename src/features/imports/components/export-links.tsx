const LINK =
  'inline-flex items-center gap-2 rounded-md border border-rule-strong bg-paper-raised px-3 py-1.5 text-sm font-medium text-ink hover:bg-paper-sunk';

/**
 * Downloads: every pin of the conversion as CSV (it imports back unchanged), and a blank pinout
 * file with the headers the import recognises and one example row.
 */
export function ExportLinks({ conversionId }: { conversionId: number }) {
  return (
    <div className="flex flex-col gap-3">
      <a className={LINK} href={`/api/conversions/${conversionId}/pins.csv`} download>
        <span aria-hidden>↓</span> All pins of this conversion (CSV)
      </a>
      <a className={LINK} href="/api/pinouts/template.csv" download>
        <span aria-hidden>↓</span> Blank pinout file to fill in (CSV)
      </a>
      <p className="text-xs text-ink-faint">
        UTF-8 CSV that spreadsheets open directly. Cells that would start a formula begin with an
        apostrophe; the import removes it again.
      </p>
    </div>
  );
}
