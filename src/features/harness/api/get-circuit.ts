import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiError } from '@/lib/api-client.ts';
import { harnessKeys } from './keys.ts';

export type CircuitKind = 'feed' | 'pin';

export const circuitSvgUrl = (conversionId: number, kind: CircuitKind, refId: number) =>
  `/api/conversions/${conversionId}/circuits/${kind}/${refId}.svg`;

/** The drawing's title and every label it writes, read from the SVG's text. */
export interface CircuitText {
  title: string;
  labels: string[];
}

/** Reads the drawing's words without running anything in it (DOMParser never runs scripts). */
export function readCircuitText(svg: string): CircuitText {
  const doc = new DOMParser().parseFromString(svg, 'image/svg+xml');
  const title = doc.querySelector('title')?.textContent?.trim() ?? 'Circuit';
  const labels = [...doc.querySelectorAll('text')]
    .map((t) => t.textContent?.trim() ?? '')
    .filter((t) => t && t !== title);
  return { title, labels: [...new Set(labels)] };
}

async function getCircuit(conversionId: number, kind: CircuitKind, refId: number) {
  const response = await fetch(circuitSvgUrl(conversionId, kind, refId), {
    credentials: 'same-origin',
  });
  if (!response.ok) {
    const body = (await response.json().catch(() => null)) as {
      error?: { code: string; message: string };
    } | null;
    throw new ApiError(
      response.status,
      body?.error?.code ?? 'http_error',
      body?.error?.message ?? `The server answered ${response.status}.`,
    );
  }
  return readCircuitText(await response.text());
}

export const getCircuitQueryOptions = (conversionId: number, kind: CircuitKind, refId: number) =>
  queryOptions({
    queryKey: [...harnessKeys.conversion(conversionId), 'circuit', kind, refId] as const,
    queryFn: () => getCircuit(conversionId, kind, refId),
  });

export const useCircuit = (conversionId: number, kind: CircuitKind, refId: number) =>
  useQuery(getCircuitQueryOptions(conversionId, kind, refId));
