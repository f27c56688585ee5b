import { useQueryClient } from '@tanstack/react-query';
import type { ColumnVisibilityState, RowSelectionState } from '@tanstack/react-table';
import {
  useCallback,
  useDeferredValue,
  useEffect,
  useMemo,
  useRef,
  useState,
  type ReactNode,
} from 'react';
import { Link } from 'react-router-dom';
import { flushSync } from 'react-dom';
import { DISPOSITION_INFO } from '#shared/domain/dispositions.ts';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { SafetyNotes } from './safety-notes.tsx';
import { useCreateConnector } from '../api/create-connector.ts';
import { useDeleteConnector } from '../api/delete-connector.ts';
import { useConnectors } from '../api/get-connectors.ts';
import { usePins } from '../api/get-pins.ts';
import { pinMapKeys } from '../api/keys.ts';
import { useUpdateConnector } from '../api/update-connector.ts';
import { usePinEditing } from '../hooks/use-pin-editing.ts';
import { useStableHandler } from '../hooks/use-stable-handler.ts';
import type { CellContext } from '../lib/cell-values.ts';
import { filterRows, NO_FILTER, revealRow, type PinFilter } from '../lib/filter.ts';
import { countDispositions, countsByConnector, pinsByConnector } from '../lib/progress.ts';
import { destinationCavities, toPinRows, type DestinationFeed, type PinRow } from '../lib/rows.ts';
import { ColumnMenu } from './column-menu.tsx';
import { ConnectorCard } from './connector-card.tsx';
import { ConnectorForm, type ConnectorFormValues } from './connector-form.tsx';
import { FilterBar } from './filter-bar.tsx';
import { PinGrid, type PinGridHandle } from './pin-grid.tsx';
import { PinMapMessages } from './pin-map-messages.tsx';
import { SelectionToolbar } from './selection-toolbar.tsx';
import { UndecidedList } from './undecided-list.tsx';
import { KeyHelp } from './key-help.tsx';
import { FirstRunPanel, FromLibraryPanel, PinMapHeader } from './pin-map-header.tsx';
import { plural } from '@/lib/plural.ts';

const EMPTY_COUNTS = countDispositions([]);

/**
 * The builder's pin map of one conversion: progress, connector faces, the undecided pins and the
 * pin grid. Reviewers and technicians see the same, without the controls that change anything.
 */
/** Ways in besides a blank connector, which belong to other features: the route hands them in. */
interface AddingFrom {
  /** The pinout library's form; it calls `added` with the new connector's id. */
  renderFromLibrary?: (added: (connectorId: number) => void) => ReactNode;
  /** Where a pinout CSV is imported. */
  importHref?: string;
}

export function PinMapScreen({
  conversionId,
  sizeUnit,
  readOnly,
  feeds,
  focusPinId,
  renderFromLibrary,
  importHref,
}: {
  conversionId: number;
  sizeUnit: SizeUnit;
  readOnly: boolean;
  /** The conversion's new feeds, which a pin can join as its destination. */
  feeds: readonly DestinationFeed[];
  /** A pin to bring into view and focus on arrival (a link from a check finding). */
  focusPinId?: number | null;
} & AddingFrom) {
  const connectors = useConnectors(conversionId);
  const pins = usePins(conversionId);
  if (connectors.isPending || pins.isPending) return <Loading what="Loading the pin map" />;
  if (connectors.isError || pins.isError) {
    return (
      <Notice tone="fault" title="The pin map could not be loaded">
        {(connectors.error ?? pins.error)?.message}
      </Notice>
    );
  }
  return (
    <PinMap
      conversionId={conversionId}
      sizeUnit={sizeUnit}
      readOnly={readOnly}
      feeds={feeds}
      focusPinId={focusPinId ?? null}
      renderFromLibrary={renderFromLibrary}
      importHref={importHref}
    />
  );
}

const NO_CONNECTORS: Connector[] = [];
const NO_PINS: Pin[] = [];

function PinMap({
  conversionId,
  sizeUnit,
  readOnly,
  feeds,
  focusPinId,
  renderFromLibrary,
  importHref,
}: {
  conversionId: number;
  sizeUnit: SizeUnit;
  readOnly: boolean;
  feeds: readonly DestinationFeed[];
  focusPinId: number | null;
} & AddingFrom) {
  // Read here rather than passed down: a render forced with flushSync (to show a pin that just
  // arrived) then sees the freshest cache.
  const connectors = useConnectors(conversionId).data ?? NO_CONNECTORS;
  const pins = usePins(conversionId).data ?? NO_PINS;
  const queryClient = useQueryClient();
  const editing = usePinEditing(conversionId);
  const createConnector = useCreateConnector(conversionId);
  const updateConnector = useUpdateConnector(conversionId);
  const deleteConnector = useDeleteConnector(conversionId);
  const gridRef = useRef<PinGridHandle>(null);

  const [filter, setFilter] = useState<PinFilter>(NO_FILTER);
  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});
  const [columnVisibility, setColumnVisibility] = useState<ColumnVisibilityState>({});
  const [form, setForm] = useState<{ connectorId: number | null } | null>(null);
  const [fromLibrary, setFromLibrary] = useState(false);

  const rows = useMemo(() => toPinRows(pins, connectors, feeds), [pins, connectors, feeds]);
  const shown = useMemo(() => filterRows(rows, filter), [rows, filter]);
  const destinations = useMemo(() => destinationCavities(pins, connectors), [pins, connectors]);
  const ctx = useMemo<CellContext>(
    () => ({ sizeUnit, destinations, feeds }),
    [sizeUnit, destinations, feeds],
  );
  // The grid follows an edit at once; the tallies, faces, cautions and undecided list above and
  // beside it follow in a render of their own, so typing in a cell does not wait for them.
  const settledPins = useDeferredValue(pins);
  const settledRows = useDeferredValue(rows);
  const counts = useMemo(() => countDispositions(settledPins), [settledPins]);
  const perConnector = useMemo(() => countsByConnector(settledPins), [settledPins]);
  const pinsOf = useMemo(() => pinsByConnector(settledPins), [settledPins]);

  const selectedIds = rows.filter((r) => rowSelection[String(r.pin.id)]).map((r) => r.pin.id);
  const shownIds = new Set(shown.map((r) => r.pin.id));
  const hiddenSelected = selectedIds.filter((id) => !shownIds.has(id)).length;

  /** Takes off the filters that hide the pin, then focuses its row. */
  const goToPin = useStableHandler((pinId: number) => {
    const row = rows.find((r) => r.pin.id === pinId);
    if (!row) return;
    flushSync(() => setFilter((f) => revealRow(row, f)));
    gridRef.current?.focusPin(pinId);
  });

  // Arriving from a finding's link: show and focus that pin once the grid is there.
  useEffect(() => {
    if (focusPinId != null) goToPin(focusPinId);
  }, [focusPinId, goToPin]);

  /** Straight on to mapping a new connector: only its pins, its first cavity focused. */
  function showNewConnector(connectorId: number) {
    const fresh = queryClient.getQueryData<Pin[]>(pinMapKeys.pins(conversionId)) ?? [];
    const first = fresh.find((p) => p.connectorId === connectorId && p.position === 0);
    flushSync(() => setFilter({ ...NO_FILTER, connectorId }));
    if (first) gridRef.current?.focusPin(first.id);
  }

  const connectorAdded = useStableHandler((connectorId: number) => {
    setFromLibrary(false);
    // The library wrote the pins: read them, then show the connector.
    void queryClient
      .invalidateQueries({ queryKey: pinMapKeys.conversion(conversionId) })
      .then(() => showNewConnector(connectorId));
  });

  const editConnector = useStableHandler((connectorId: number) => setForm({ connectorId }));
  const removeConnector = useStableHandler((c: Connector) =>
    deleteConnector.mutate(c.id, {
      onSuccess: () => {
        if (filter.connectorId === c.id) setFilter(NO_FILTER);
        editing.notify({ tone: 'sound', title: `Connector ${c.label} deleted.` });
      },
      onError: (error) =>
        editing.notify({
          tone: 'fault',
          title: `${c.label} was not deleted: ${error.message}`,
        }),
    }),
  );

  const circuitLink = useCallback(
    (row: PinRow) => (
      <Link
        to={paths.conversionCircuit.getHref(conversionId, 'pin', row.pin.id)}
        className="self-start text-sm text-copper-deep underline-offset-2 hover:underline"
      >
        Show circuit of {row.name}
      </Link>
    ),
    [conversionId],
  );

  const filterUndecided = useStableHandler(() =>
    setFilter({ ...NO_FILTER, disposition: 'undecided' }),
  );

  function openBlank() {
    setFromLibrary(false);
    setForm({ connectorId: null });
  }
  function openLibrary() {
    setForm(null);
    setFromLibrary(true);
  }

  async function saveConnector(values: ConnectorFormValues) {
    if (form?.connectorId) {
      const current = connectors.find((c) => c.id === form.connectorId);
      if (!current) return;
      await updateConnector.mutateAsync({
        connectorId: current.id,
        input: { ...values, version: current.version },
      });
      setForm(null);
      return;
    }
    const { connector } = await createConnector.mutateAsync(values);
    setForm(null);
    showNewConnector(connector.id);
  }

  const editingConnector = form?.connectorId
    ? connectors.find((c) => c.id === form.connectorId)
    : undefined;
  const connectorMutation = form?.connectorId ? updateConnector : createConnector;

  return (
    <div className="flex flex-col gap-5">
      <PinMapHeader
        conversionId={conversionId}
        counts={counts}
        readOnly={readOnly}
        history={editing.history}
        onUndo={editing.undo}
        onFromLibrary={renderFromLibrary ? openLibrary : null}
        onAddConnector={openBlank}
      />

      {readOnly ? (
        <Notice tone="info" title="Read only">
          Your role can look through the pin map, filter it and copy from it, but not change it.
        </Notice>
      ) : null}
      <SafetyNotes pins={settledPins} />

      {form && !readOnly ? (
        <ConnectorForm
          key={form.connectorId ?? 'new'}
          connector={editingConnector}
          busy={connectorMutation.isPending}
          error={connectorMutation.error}
          onSubmit={(values) => void saveConnector(values).catch(() => undefined)}
          onCancel={() => {
            connectorMutation.reset();
            setForm(null);
          }}
        />
      ) : null}

      {fromLibrary && renderFromLibrary && !readOnly ? (
        <FromLibraryPanel onCancel={() => setFromLibrary(false)}>
          {renderFromLibrary(connectorAdded)}
        </FromLibraryPanel>
      ) : null}

      {connectors.length === 0 && !readOnly && !form && !fromLibrary ? (
        <FirstRunPanel
          onFromLibrary={renderFromLibrary ? openLibrary : null}
          importHref={importHref}
          onByHand={openBlank}
        />
      ) : null}

      <details open aria-labelledby="faces-heading">
        <summary className="mb-2 cursor-pointer">
          <h2 id="faces-heading" className="inline text-base font-semibold">
            Connectors <span className="font-normal text-ink-faint">({connectors.length})</span>
          </h2>
          <span className="ml-2 text-sm text-ink-faint">faces and progress</span>
        </summary>
        {connectors.length === 0 ? (
          <p className="text-ink-soft">No connectors yet.</p>
        ) : (
          <div className="grid grid-flow-row-dense gap-3 md:grid-cols-2 xl:grid-cols-3">
            {connectors.map((c) => (
              <ConnectorCard
                key={c.id}
                wide={c.columns > 11}
                connector={c}
                pins={pinsOf.get(c.id) ?? NO_PINS}
                counts={perConnector.get(c.id) ?? EMPTY_COUNTS}
                unit={sizeUnit}
                canWrite={!readOnly}
                deleting={deleteConnector.isPending && deleteConnector.variables === c.id}
                onActivate={goToPin}
                onEdit={editConnector}
                onDelete={removeConnector}
              />
            ))}
          </div>
        )}
      </details>

      {connectors.length === 0 ? null : (
        <>
          <UndecidedList rows={settledRows} onJump={goToPin} onFilterUndecided={filterUndecided} />

          <section aria-label="Pin grid" className="flex flex-col gap-3">
            <FilterBar
              filter={filter}
              onChange={setFilter}
              connectors={connectors}
              shown={shown.length}
              total={rows.length}
            >
              <ColumnMenu
                visibility={columnVisibility}
                onChange={setColumnVisibility}
                unit={sizeUnit}
              />
            </FilterBar>
            <PinMapMessages messages={editing.messages} onDismiss={editing.dismiss} />
            {!readOnly && selectedIds.length > 0 ? (
              <SelectionToolbar
                count={selectedIds.length}
                hiddenCount={hiddenSelected}
                destinations={destinations}
                feeds={feeds}
                onSetDisposition={(d) =>
                  editing.writeSelection(
                    selectedIds,
                    { disposition: d },
                    `disposition ${DISPOSITION_INFO[d].label.toLowerCase()} on ${plural(selectedIds.length, 'pin')}`,
                  )
                }
                onSetDestination={(set) =>
                  editing.writeSelection(
                    selectedIds,
                    set,
                    `destination on ${plural(selectedIds.length, 'pin')}`,
                  )
                }
                onClear={() => setRowSelection({})}
              />
            ) : null}
            <PinGrid
              ref={gridRef}
              rows={shown}
              ctx={ctx}
              readOnly={readOnly}
              rowSelection={rowSelection}
              onRowSelectionChange={setRowSelection}
              columnVisibility={columnVisibility}
              onColumnVisibilityChange={setColumnVisibility}
              editing={editing}
              describedBy="pin-grid-keys"
              renderActivePin={circuitLink}
            />
            <KeyHelp readOnly={readOnly} />
          </section>
        </>
      )}
    </div>
  );
}
