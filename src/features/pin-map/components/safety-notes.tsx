import { memo } from 'react';
import { cautionsForPins } from '#shared/domain/safety.ts';
import type { Pin } from '#shared/schemas/pin-map.schema.ts';
import { Notice } from '@/components/ui/notice.tsx';

/**
 * The cautions that concern the pins of this map (ECU stages, fuel pump, airbag, regulated
 * circuits), said beside the grid where the decisions are made. Local codes prevail.
 */
export const SafetyNotes = memo(function SafetyNotes({ pins }: { pins: readonly Pin[] }) {
  // Memoised as a whole: it renders only when the pins change, and then the cautions must too.
  const cautions = cautionsForPins(pins);
  if (!cautions.length) return null;
  return (
    <Notice tone="caution" title="Working on these pins">
      <details>
        <summary className="cursor-pointer">
          {cautions.length} {cautions.length === 1 ? 'caution applies' : 'cautions apply'} to the
          pins of this map
        </summary>
        <ul className="mt-1 list-disc pl-5">
          {cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
        <p className="mt-1">Local codes and licensed practice prevail.</p>
      </details>
    </Notice>
  );
});
