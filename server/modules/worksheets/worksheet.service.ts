import { checkReport } from '#shared/domain/checks/run-checks.ts';
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import type { WorkshopSettings } from '#shared/schemas/workshop.schema.ts';
import type { Actor } from '../../lib/actor.ts';
import { loadConversionSnapshot } from '../checks/snapshot.service.ts';
import { revisionForPrint } from '../revisions/revisions.service.ts';
import { getWorkshopSettings } from '../workshop/workshop.service.ts';
import type { WorksheetInput, WorksheetMeta, WorksheetRevision } from './pdf/meta.ts';

/** What every worksheet takes from the workshop's settings today, and when it was printed. */
function workshopMeta(
  settings: WorkshopSettings,
  printedAt: Date,
): Omit<WorksheetMeta, 'revision' | 'findings'> {
  return {
    workshopName: settings.name,
    paperSize: settings.paperSize,
    sizeUnit: settings.sizeUnit,
    serviceAllowancePct: settings.serviceAllowancePct,
    printedAt,
  };
}

/**
 * The current draft of a conversion as the worksheet prints it: the live plan, the workshop's
 * paper, unit and allowance, and the checks run now. Another workshop's conversion is a 404.
 */
export async function draftWorksheetInput(
  actor: Pick<Actor, 'workshopId'>,
  conversionId: number,
  now = new Date(),
): Promise<WorksheetInput> {
  const snapshot = await loadConversionSnapshot(actor, conversionId);
  const settings = await getWorkshopSettings(actor);
  const { findings } = checkReport(
    snapshot,
    { sizeUnit: settings.sizeUnit, dropAllowances: settings.dropAllowances },
    now,
  );
  return {
    snapshot,
    meta: { ...workshopMeta(settings, now), revision: null, findings },
  };
}

/**
 * A revision as the worksheet prints it: its frozen snapshot and the findings frozen with it, its
 * status, hash and sign-off; paper, unit and allowance from the workshop's settings today.
 */
export async function revisionWorksheetInput(
  actor: Actor,
  conversionId: number,
  number: number,
  now = new Date(),
): Promise<WorksheetInput> {
  const { revision, snapshot, findings, seal } = await revisionForPrint(
    actor,
    conversionId,
    number,
  );
  const settings = await getWorkshopSettings(actor);
  return {
    snapshot,
    meta: {
      ...workshopMeta(settings, now),
      revision: {
        number: revision.number,
        status: revision.status,
        hash: revision.hash,
        signOff:
          revision.status === 'signed_off' && revision.signedAt
            ? {
                reviewerName: revision.reviewedByName ?? '',
                signedAt: revision.signedAt,
                hash: revision.hash,
                seal: seal ? { publicKey: seal.publicKey, fingerprint: seal.fingerprint } : null,
              }
            : null,
      },
      findings,
    },
  };
}

/**
 * "ashby-yard-truck-draft-worksheet.pdf": ASCII letters, digits and hyphens only, so the name is
 * safe in a Content-Disposition header and on any file system.
 */
export function worksheetFileName(
  snapshot: Pick<ConversionSnapshot, 'conversion'>,
  revision: Pick<WorksheetRevision, 'number'> | null,
): string {
  const slug = snapshot.conversion.name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/g, '');
  const base = slug || `conversion-${snapshot.conversion.id}`;
  return `${base}-${revision ? `rev${revision.number}` : 'draft'}-worksheet.pdf`;
}
