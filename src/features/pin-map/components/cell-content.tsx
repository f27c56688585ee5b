import { DRIVER_TYPE_SHORT, PULSE_SIGNAL_LABELS } from '#shared/domain/fields/text-parsers.ts';
import { regulatedCategory } from '#shared/domain/regulated-circuits.ts';
import { SIGNAL_CLASS_LABELS } from '#shared/domain/signal-classes.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import type { PinColumnId } from '../lib/columns.ts';
import type { PinRow } from '../lib/rows.ts';
import { DispositionLabel } from '@/components/ui/disposition-glyph.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';

const Empty = () => <span className="text-ink-faint">—</span>;

const numberCell = (value: number | null) =>
  value == null ? <Empty /> : <span className="font-mono text-[0.8125rem]">{value}</span>;

/** How a cell reads when it is not being edited. */
export function CellContent({
  row,
  column,
  unit,
}: {
  row: PinRow;
  column: PinColumnId;
  unit: SizeUnit;
}) {
  const { pin } = row;
  switch (column) {
    case 'connector':
      return <span className="font-mono text-[0.8125rem] text-ink-soft">{row.connectorLabel}</span>;
    case 'cavity':
      return <span className="font-mono text-[0.875rem] font-semibold">{pin.cavity}</span>;
    case 'function': {
      if (!pin.function) return <Empty />;
      const regulated = regulatedCategory(pin.function);
      return (
        <span className="flex min-w-0 items-center gap-1.5">
          <span className="truncate">{pin.function}</span>
          {regulated ? (
            <span
              className="shrink-0 rounded border border-caution/50 px-1 text-[0.6875rem] font-semibold text-caution"
              title={`${regulated.caution} Changing it may be unlawful where the vehicle is used; check local rules.`}
            >
              {regulated.label}
            </span>
          ) : null}
        </span>
      );
    }
    case 'signalClass':
      return pin.signalClass === 'none' ? (
        <Empty />
      ) : (
        <span className="truncate">{SIGNAL_CLASS_LABELS[pin.signalClass]}</span>
      );
    case 'colour':
      return <WireColour value={pin.colour} />;
    case 'size':
      return pin.sizeMm2 == null ? (
        <Empty />
      ) : (
        <span className="font-mono text-[0.8125rem]">{formatWireSize(pin.sizeMm2, unit)}</span>
      );
    case 'insulation':
      return pin.insulationRatingC == null ? (
        <Empty />
      ) : (
        <span className="font-mono text-[0.8125rem]">{pin.insulationRatingC} °C</span>
      );
    case 'disposition':
      return <DispositionLabel disposition={pin.disposition} />;
    case 'destination':
      if (row.linkedDestination) {
        return (
          <span className="font-mono text-[0.8125rem]">
            <span aria-hidden>→ </span>
            {row.linkedDestination}
            <span className="sr-only">
              {pin.destinationFeedId != null
                ? ' (joined to this new feed)'
                : ' (linked vehicle-side cavity)'}
            </span>
          </span>
        );
      }
      return pin.destination ? <span className="truncate">{pin.destination}</span> : <Empty />;
    case 'runLength':
      return numberCell(pin.runLengthM);
    case 'load':
      return numberCell(pin.loadCurrentA);
    case 'driverType':
      return pin.driverType ? <span>{DRIVER_TYPE_SHORT[pin.driverType]}</span> : <Empty />;
    case 'driverRated':
      return numberCell(pin.driverRatedA);
    case 'pulseSignal':
      return pin.pulseSignal ? <span>{PULSE_SIGNAL_LABELS[pin.pulseSignal]}</span> : <Empty />;
    case 'pulsesPerRev':
      return numberCell(pin.pulsesPerRev);
    case 'termination':
      return numberCell(pin.terminationOhm);
    case 'notes':
      return pin.notes ? <span className="truncate text-ink-soft">{pin.notes}</span> : <Empty />;
  }
}
