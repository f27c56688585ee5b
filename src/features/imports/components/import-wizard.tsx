import { useId, useMemo, useState, type ChangeEvent } from 'react';
import { Link } from 'react-router-dom';
import {
  describeGrowth,
  type ColumnMapping,
  type ColumnTarget,
  type ImportResult,
} from '#shared/schemas/imports.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { refusedResult, useApplyImport } from '../api/apply-import.ts';
import { usePreviewImport } from '../api/preview-import.ts';
import { targetName, type ImportTarget } from '../lib/import-target.ts';
import { indexPreview, plural } from '../lib/preview.ts';
import { ChangeList } from './change-list.tsx';
import { PreviewPager, PreviewTable } from './preview-table.tsx';

const SOURCE_WORDS: Record<ImportResult['mappingSource'], string> = {
  detected: 'Columns were matched by their headers.',
  saved: 'Column choices are the ones your workshop used last time for a file with these columns.',
  given: 'Column choices are yours.',
};

const sameMapping = (a: ColumnMapping[], b: ColumnMapping[]) =>
  a.length === b.length && a.every((m, i) => m.target === b[i]!.target);

/**
 * Import a pinout CSV: choose the file, check the columns, see every problem in its cell and what
 * would change, then apply it all at once.
 */
export function ImportWizard({
  target,
  pinMapHref,
  onApplied,
}: {
  target: ImportTarget;
  pinMapHref: string;
  onApplied?: (result: ImportResult) => void;
}) {
  const fileId = useId();
  const preview = usePreviewImport(target);
  const apply = useApplyImport(target, onApplied);
  const [file, setFile] = useState<File | null>(null);
  const [result, setResult] = useState<ImportResult | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping[]>([]);
  // The cavities a file adds to a connector that lacks them are confirmed, never slipped in.
  const [growthConfirmed, setGrowthConfirmed] = useState(false);
  // Cleared by apply.reset() whenever a file is checked.
  const applied = apply.data;

  const refused = useMemo(() => refusedResult(apply.error), [apply.error]);
  const shown = useMemo(
    () => (refused && result ? { ...result, ...refused } : result),
    [refused, result],
  );
  const index = useMemo(() => (shown ? indexPreview(shown) : null), [shown]);
  const mappingChanged = result ? !sameMapping(mapping, result.mapping) : false;

  function check(next: File, choices?: ColumnMapping[], page = 1) {
    apply.reset();
    if (page === 1) setGrowthConfirmed(false);
    preview.mutate(
      { file: next, mapping: choices, page },
      {
        onSuccess: (r) => {
          setResult(r);
          setMapping(r.mapping);
        },
      },
    );
  }

  function choose(event: ChangeEvent<HTMLInputElement>) {
    const next = event.target.files?.[0];
    // Clear the input so the same file, fixed and saved again, can be chosen again.
    event.target.value = '';
    if (!next) return;
    setFile(next);
    setResult(null);
    check(next);
  }

  function changeColumn(column: number, next: ColumnTarget) {
    setMapping((current) => current.map((m, i) => (i === column ? { ...m, target: next } : m)));
  }

  function applyFile() {
    if (!file || !result) return;
    apply.mutate(
      { file, mapping: result.mapping, grow: growthConfirmed, previewId: result.previewId },
      { onSuccess: () => setResult(null) },
    );
  }

  const errorCount = shown?.errorCount ?? 0;
  const growth = shown?.growth ?? [];
  const canApply =
    !!shown &&
    errorCount === 0 &&
    !mappingChanged &&
    shown.rows > 0 &&
    (growth.length === 0 || growthConfirmed);
  const into = targetName(target);

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-end gap-4">
        <div className="flex flex-col gap-1">
          <label htmlFor={fileId} className="text-sm font-medium text-ink-soft">
            Pinout file (CSV)
          </label>
          <input
            id={fileId}
            type="file"
            accept=".csv,.tsv,.txt,text/csv,text/plain"
            onChange={choose}
            className="text-sm file:mr-3 file:rounded-md file:border file:border-rule-strong file:bg-paper-raised file:px-3 file:py-1.5 file:font-medium file:text-ink hover:file:bg-paper-sunk"
          />
        </div>
        <p className="max-w-xl text-sm text-ink-faint">
          UTF-8 text with a header line; commas, semicolons or tabs between columns; at most 2 MB
          and 20,000 rows. Nothing is written until you press Import.
        </p>
      </div>

      {preview.isPending ? <Loading what={`Reading ${file?.name ?? 'the file'}`} /> : null}
      {preview.isError ? (
        <Notice tone="fault" title="The file could not be checked">
          {preview.error.message}
        </Notice>
      ) : null}

      {applied ? (
        <Notice tone="sound" title={`Imported ${plural(applied.imported, 'row')} into ${into}`}>
          <p>
            {plural(applied.summary.added, 'cavity', 'cavities')} added, {applied.summary.changed}{' '}
            changed, {applied.summary.removed} removed, {applied.summary.unchanged} unchanged. One
            entry was added to the history.
          </p>
          <p className="mt-2 flex flex-wrap gap-3">
            <Link to={pinMapHref} className="font-medium text-copper-deep underline">
              Open the pin map
            </Link>
          </p>
        </Notice>
      ) : null}

      {shown && index ? (
        <div className="flex flex-col gap-4">
          <div className="flex flex-wrap items-center gap-x-4 gap-y-1">
            <h3 className="font-semibold">
              {file?.name}: {plural(shown.rows, 'pin row')}
            </h3>
            {errorCount ? (
              <span className="font-semibold text-fault">
                <span aria-hidden>✕ </span>
                {plural(errorCount, 'problem')} — fix {errorCount === 1 ? 'it' : 'them'} in the file
                and choose it again
              </span>
            ) : (
              <span className="font-semibold text-sound">
                <span aria-hidden>✓ </span>No problems found
              </span>
            )}
          </div>
          {refused ? (
            <Notice tone="fault" title="Nothing was imported">
              {apply.error?.message}
            </Notice>
          ) : null}
          {index.file.length ? (
            <Notice tone="fault" title="Problems with the file as a whole">
              <ul className="list-disc pl-5">
                {index.file.map((issue, i) => (
                  <li key={i}>
                    {issue.row
                      ? `Line ${issue.row}${issue.column ? `, column “${issue.column}”` : ''}: `
                      : issue.column
                        ? `Column “${issue.column}”: `
                        : ''}
                    {issue.message}
                  </li>
                ))}
              </ul>
            </Notice>
          ) : null}
          {shown.errors.length < shown.errorCount ? (
            <p className="text-sm text-ink-soft">
              The first {shown.errors.length} problems are shown.
            </p>
          ) : null}
          {shown.notes.length ? (
            <ul className="flex flex-col gap-0.5 text-sm text-ink-soft">
              {[SOURCE_WORDS[shown.mappingSource], ...shown.notes].map((note, i) => (
                <li key={i}>
                  <span aria-hidden className="mr-1.5 text-ink-faint">
                    i
                  </span>
                  {note}
                </li>
              ))}
            </ul>
          ) : null}
          {mappingChanged ? (
            <div className="flex flex-wrap items-center gap-3 rounded-md border border-copper/40 bg-copper-wash px-3 py-2 text-sm">
              <span>You changed the column choices.</span>
              <Button
                size="sm"
                variant="secondary"
                busy={preview.isPending}
                onClick={() => file && check(file, mapping)}
              >
                Check again with these columns
              </Button>
            </div>
          ) : null}
          {result?.page ? (
            <PreviewPager
              page={result.page}
              lines={result.rows}
              busy={preview.isPending}
              onPage={(page) => file && check(file, result.mapping, page)}
            />
          ) : null}
          {result?.table ? (
            <PreviewTable
              table={result.table}
              mapping={mapping}
              index={index}
              planned={shown.planned}
              onMappingChange={changeColumn}
              disabled={preview.isPending || apply.isPending}
            />
          ) : null}
          {shown.planned ? (
            <ChangeList
              changes={shown.changes}
              summary={shown.summary}
              title={`What the import would change in ${into}`}
              partial={index.problemRows.size > 0}
            />
          ) : null}
          {growth.length && errorCount === 0 ? (
            <Notice tone="caution" title="The file adds cavities a connector does not have">
              <ul className="list-disc pl-5">
                {growth.map((g) => (
                  <li key={g.connector}>{describeGrowth(g)}</li>
                ))}
              </ul>
              <p className="mt-1">
                Often a typing slip in the cavity column. If the connector really has them, confirm
                and it grows, face and all.
              </p>
              <label className="mt-2 flex items-center gap-2 font-medium text-ink">
                <input
                  type="checkbox"
                  checked={growthConfirmed}
                  onChange={(e) => setGrowthConfirmed(e.target.checked)}
                />
                Add{' '}
                {growth.length === 1 && growth[0]!.cavities.length === 1
                  ? 'this cavity'
                  : 'these cavities'}
              </label>
            </Notice>
          ) : null}
          <div className="flex flex-wrap items-center gap-3 border-t border-rule pt-4">
            <Button
              variant="primary"
              disabled={!canApply}
              busy={apply.isPending}
              onClick={applyFile}
            >
              Import {plural(shown.rows, 'row')} into {into}
            </Button>
            <span className="text-sm text-ink-soft">
              {errorCount
                ? 'Importing is possible once the file has no problems: all rows go in together, or none.'
                : mappingChanged
                  ? 'Check the file again with your column choices first.'
                  : growth.length && !growthConfirmed
                    ? 'Confirm the new cavities above first, or correct the file.'
                    : 'All rows go in together in one step; your column choices are remembered.'}
            </span>
          </div>
        </div>
      ) : null}
    </div>
  );
}
