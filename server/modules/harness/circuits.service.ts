/** Circuit diagrams of a conversion's live plan, drawn from its harness. */
import { HarnessGraph } from '#shared/domain/harness/circuit-graph.ts';
import { circuitSvg, layoutCircuit } from '#shared/domain/harness/circuit-layout.ts';
import type { Actor } from '../../lib/actor.ts';
import { notFound } from '../../lib/errors.ts';
import { loadConversionSnapshot } from '../checks/snapshot.service.ts';
import { getWorkshopSettings } from '../workshop/workshop.service.ts';

async function graphOf(actor: Actor, conversionId: number) {
  const snapshot = await loadConversionSnapshot(actor, conversionId);
  const { sizeUnit } = await getWorkshopSettings(actor);
  return new HarnessGraph(snapshot, snapshot.harness!, sizeUnit);
}

export async function feedCircuitSvg(
  actor: Actor,
  conversionId: number,
  feedId: number,
): Promise<string> {
  const circuit = (await graphOf(actor, conversionId)).feedCircuit(feedId);
  if (!circuit) throw notFound('That feed');
  return circuitSvg(layoutCircuit(circuit));
}

export async function pinCircuitSvg(
  actor: Actor,
  conversionId: number,
  pinId: number,
): Promise<string> {
  const circuit = (await graphOf(actor, conversionId)).pinCircuit(pinId);
  if (!circuit) throw notFound('That pin');
  return circuitSvg(layoutCircuit(circuit));
}
