import bcrypt from 'bcryptjs';
import type { Sequelize, Transaction } from 'sequelize';
import { benchPlanItems } from '#shared/domain/bench.ts';
import { checkReport } from '#shared/domain/checks/run-checks.ts';
import { revisionHash } from '#shared/domain/revisions/content-hash.ts';
import {
  AuditEvent,
  BenchRecord,
  Connector,
  Conversion,
  Feed,
  FeedLoad,
  Pin,
  Revision,
  User,
  Workshop,
} from '../server/db/models/index.ts';
import { toSessionUser } from '../server/modules/auth/auth.service.ts';
import { loadConversionSnapshot } from '../server/modules/checks/snapshot.service.ts';
import { sealOf } from '../server/modules/revisions/revisions.service.ts';
import { saveTemplate } from '../server/modules/library/library.service.ts';
import { DEMO_CONVERSIONS, DEMO_USERS, DEMO_WORKSHOP } from './demo-data.ts';
import { DRAFT_FEEDS, SIGNED_OFF_FEEDS, type DemoFeed } from './feeds-data.ts';
import { seedHarness } from './harness-data.ts';
import { DRAFT_CONNECTORS, SIGNED_OFF_CONNECTORS, type DemoConnector } from './pin-map-data.ts';

export interface DemoSeedResult {
  workshopId: number;
  users: Record<string, number>;
  conversions: { signedOff: number; draft: number };
}

/** True when the database holds no workshop yet (a fresh file). */
export async function isEmpty(): Promise<boolean> {
  return (await Workshop.count()) === 0;
}

/**
 * Seeds the demo workshop unless another process already has: several app processes may start
 * together on one new database, each finding it empty. The seeding is one transaction, so the
 * process that loses the race fails on the demo users' unique addresses with nothing written, and
 * finds the workshop there when it looks again. Answers whether this process seeded it.
 */
export async function seedDemoOnce(
  sequelize: Sequelize,
  options: { password: string; bcryptCost: number; sealKeyPem: string },
): Promise<boolean> {
  try {
    await seedDemo(sequelize, options);
    return true;
  } catch (error) {
    if (!(await isEmpty())) return false;
    throw error;
  }
}

/**
 * Seeds the demo workshop in one transaction: the workshop, one user per role, and the two demo
 * conversions. Later steps add each conversion's pins, feeds and revisions.
 */
export async function seedDemo(
  sequelize: Sequelize,
  options: { password: string; bcryptCost: number; sealKeyPem: string },
): Promise<DemoSeedResult> {
  const passwordHash = await bcrypt.hash(options.password, options.bcryptCost);
  const result = await sequelize.transaction(async (transaction) => {
    const workshop = await Workshop.create(DEMO_WORKSHOP, { transaction });
    const users: Record<string, number> = {};
    for (const u of DEMO_USERS) {
      const user = await User.create(
        { ...u, workshopId: workshop.id, passwordHash },
        { transaction },
      );
      users[u.role] = user.id;
    }
    const builderId = users.builder!;
    const signedOff = await Conversion.create(
      { ...DEMO_CONVERSIONS.signedOff, workshopId: workshop.id, createdById: builderId },
      { transaction },
    );
    const draft = await Conversion.create(
      { ...DEMO_CONVERSIONS.draft, workshopId: workshop.id, createdById: builderId },
      { transaction },
    );
    const signedOffPins = await seedPinMap(signedOff.id, SIGNED_OFF_CONNECTORS, transaction);
    await seedFeeds(signedOff.id, SIGNED_OFF_FEEDS, signedOffPins, transaction);
    await seedHarness(sequelize, signedOff.id, { draft: false }, transaction);
    await seedSignedOffRevision(workshop.id, signedOff.id, users, options.sealKeyPem, transaction);
    const draftPins = await seedPinMap(draft.id, DRAFT_CONNECTORS, transaction);
    await seedFeeds(draft.id, DRAFT_FEEDS, draftPins, transaction);
    await seedHarness(sequelize, draft.id, { draft: true }, transaction);
    await seedHistory(workshop.id, { signedOff: signedOff.id, draft: draft.id }, transaction);
    return {
      workshopId: workshop.id,
      users,
      conversions: { signedOff: signedOff.id, draft: draft.id },
    };
  });
  await seedLibrary(result);
  return result;
}

/**
 * The shop maps the KT-20 again and again: its three ECU connectors are in the library, saved
 * from the signed-off conversion the way a builder would (through the library service).
 */
async function seedLibrary(result: DemoSeedResult) {
  const builder = await User.findByPk(result.users.builder!, { include: [Workshop] });
  const actor = {
    ...toSessionUser(builder!, (builder as User & { Workshop: Workshop }).Workshop),
    requestId: 'demo-seed',
  };
  const descriptions: Record<string, string> = {
    E1: 'Engine sensors and actuators. Stays with the engine harness in every KT-20 swap so far.',
    E2: 'Vehicle side: main relay, feeds, starter, pump and fan relays, tach, lamp, speed, CAN, K-line.',
    E3: 'Automatic transmission and evaporative circuits: de-pinned or cut in a manual, carburettor-era vehicle.',
  };
  const connectors = await Connector.findAll({
    where: { conversionId: result.conversions.signedOff, side: 'ecu' },
    order: [['id', 'ASC']],
  });
  for (const c of connectors) {
    await saveTemplate(actor, {
      connectorId: c.id,
      name: `KT-20 ECU connector ${c.label}`,
      description: descriptions[c.label] ?? '',
    });
  }
}

/**
 * Creates the connectors and pins of one conversion. A destination written "V1-3" that names a
 * cavity of a vehicle-side connector becomes a link to that pin.
 */
async function seedPinMap(
  conversionId: number,
  connectors: DemoConnector[],
  transaction: Transaction,
) {
  const pinIds = new Map<string, number>();
  const vehicleSide = new Set(connectors.filter((c) => c.side === 'vehicle').map((c) => c.label));
  const created: Array<{ pin: Pin; destination: string }> = [];
  for (const c of connectors) {
    const connector = await Connector.create(
      {
        conversionId,
        label: c.label,
        side: c.side,
        cavityCount: c.pins.length,
        rows: c.rows,
        columns: c.columns,
        notes: c.notes,
      },
      { transaction },
    );
    for (const [position, p] of c.pins.entries()) {
      const [
        cavity,
        fn,
        signalClass,
        colour,
        sizeMm2,
        disposition,
        destination,
        runLengthM,
        loadCurrentA,
      ] = p;
      const pin = await Pin.create(
        {
          conversionId,
          connectorId: connector.id,
          cavity,
          position,
          function: fn,
          signalClass,
          colour,
          sizeMm2,
          insulationRatingC: sizeMm2 == null ? null : 105,
          disposition,
          destination,
          runLengthM: runLengthM ?? null,
          loadCurrentA: loadCurrentA ?? null,
        },
        { transaction },
      );
      pinIds.set(`${c.label}-${cavity}`, pin.id);
      created.push({ pin, destination });
    }
  }
  for (const { pin, destination } of created) {
    const [label] = destination.split('-');
    const target = pinIds.get(destination);
    if (target && label && vehicleSide.has(label)) {
      pin.set({ destinationPinId: target, destination: '' });
      await pin.save({ transaction });
    }
  }
  return pinIds;
}

/** Creates the feeds of one conversion and joins the pins that feed them. */
async function seedFeeds(
  conversionId: number,
  feeds: DemoFeed[],
  pinIds: Map<string, number>,
  transaction: Transaction,
) {
  const pinId = (name: string | null) => {
    if (name === null) return null;
    const id = pinIds.get(name);
    if (id === undefined) throw new Error(`demo feed refers to unknown pin ${name}`);
    return id;
  };
  const feedIds = new Map<string, number>();
  for (const f of feeds) {
    const feed = await Feed.create(
      {
        conversionId,
        name: f.name,
        source: f.source,
        sourceFeedId: f.sourceFeed ? feedIds.get(f.sourceFeed)! : null,
        fuseA: f.fuseA,
        hasRelay: f.relay !== null,
        relayContactRatingA: f.relay?.contactRatingA ?? null,
        relayCoilCurrentA: f.relay?.coilCurrentA ?? null,
        relayCoilPinId: pinId(f.relay?.coilPin ?? null),
        wireSizeMm2: f.wire.sizeMm2,
        wireInsulationRatingC: f.wire.insulationRatingC,
        wireLengthM: f.wire.lengthM,
        wireZone: f.wire.zone,
        wireBundled: f.wire.bundled,
        wireReturnPath: f.wire.returnPath,
        wireColour: f.wire.colour,
        dropClass: f.dropClass,
        dropLimitPct: f.dropLimitPct,
        notes: f.notes,
      },
      { transaction },
    );
    feedIds.set(f.name, feed.id);
    await FeedLoad.bulkCreate(
      f.loads.map((l, position) => ({
        feedId: feed.id,
        pinId: pinId(l.pin),
        name: l.name,
        currentA: l.currentA,
        continuous: l.continuous,
        position,
      })),
      { transaction },
    );
    for (const name of f.joinedPins) {
      await Pin.update(
        { destinationFeedId: feed.id, destination: '' },
        { where: { id: pinId(name)! }, transaction },
      );
    }
  }
}

/**
 * Revision 1 of the signed-off conversion: submitted by the builder a week ago and signed off by the
 * reviewer two days later, frozen with its findings and hash exactly as the review service does.
 */
async function seedSignedOffRevision(
  workshopId: number,
  conversionId: number,
  users: Record<string, number>,
  sealKeyPem: string,
  transaction: Transaction,
) {
  const snapshot = await loadConversionSnapshot({ workshopId }, conversionId, transaction);
  const { findings } = checkReport(snapshot, { sizeUnit: 'mm2' });
  if (findings.some((f) => f.severity === 'error')) {
    const errors = findings.filter((f) => f.severity === 'error').map((f) => f.message);
    throw new Error(`the signed-off demo conversion must pass its checks: ${errors.join(' | ')}`);
  }
  const builder = await User.findByPk(users.builder!, { transaction });
  const reviewer = await User.findByPk(users.reviewer!, { transaction });
  const submittedAt = new Date(Date.now() - 7 * 86_400_000);
  const signedAt = new Date(Date.now() - 5 * 86_400_000);
  const revision = Revision.build({
    conversionId,
    number: 1,
    status: 'signed_off',
    snapshotJson: JSON.stringify(snapshot),
    findingsJson: JSON.stringify(findings),
    hash: await revisionHash(snapshot, findings),
    submittedById: builder!.id,
    submittedByName: builder!.name,
    submittedAt,
    reviewedById: reviewer!.id,
    reviewedByName: reviewer!.name,
    reviewedAt: signedAt,
    signedAt,
    reviewComment:
      'Checked against the donor pinout sheet. Fuel pump wire upsized to 4 mm² as discussed.',
  });
  revision.set(sealOf(revision, sealKeyPem));
  await revision.save({ transaction });
  // The technician has started: the transmission and evaporative pins are de-pinned or cut back, and
  // the first joined wires are in with their continuity readings.
  const technician = await User.findByPk(users.technician!, { transaction });
  const items = benchPlanItems(snapshot);
  const wired = items.filter((i) => i.reading !== null && i.kind === 'pin').slice(0, 6);
  for (const [i, item] of [...items.slice(0, 14), ...wired].entries()) {
    const tested = i >= 14;
    await BenchRecord.create(
      {
        revisionId: revision.id,
        itemKey: item.key,
        ticksJson: JSON.stringify(
          Object.fromEntries(item.ticks.map((t) => [t.key, t.key === 'tested' ? tested : true])),
        ),
        reading: tested ? Number((0.05 + 0.01 * (i - 14)).toFixed(2)) : null,
        note: i === 2 ? 'Terminal lock tab was broken; replaced the housing wedge.' : '',
        recordedById: technician!.id,
        recordedByName: technician!.name,
      },
      { transaction },
    );
  }
}

/**
 * A believable history for the demo: what the audit trail would hold after the work the demo
 * shows, dated over the past fortnight. Written directly, as the trail itself refuses changes.
 */
async function seedHistory(
  workshopId: number,
  conversions: { signedOff: number; draft: number },
  transaction: Transaction,
) {
  const names = Object.fromEntries(
    (await User.findAll({ where: { workshopId }, transaction })).map((u) => [u.role, u]),
  );
  const day = 86_400_000;
  const events: Array<[number, number, string, string, string, string]> = [
    // [days ago, conversion, role, action, entity type, summary]
    [
      14,
      conversions.signedOff,
      'builder',
      'create',
      'conversion',
      'Created conversion "Pellow farm flatbed"',
    ],
    [
      13,
      conversions.signedOff,
      'builder',
      'import',
      'connector',
      'Imported the pinouts of E1, E2 and E3 from the donor sheet',
    ],
    [
      12,
      conversions.signedOff,
      'builder',
      'batch_update',
      'pin',
      'Decided the transmission and evaporative pins of E3: de-pin or cut',
    ],
    [
      11,
      conversions.signedOff,
      'builder',
      'create',
      'feed',
      'Added feeds "ECU main", "Ignition coils", "Fuel pump", "Cooling fan", "Diagnostic and memory"',
    ],
    [
      8,
      conversions.signedOff,
      'builder',
      'update',
      'feed',
      'Changed feed "Fuel pump": wire 2.5 mm² → 4 mm² after the voltage-drop check',
    ],
    [7, conversions.signedOff, 'builder', 'submit', 'revision', 'Submitted revision 1 for review'],
    [5, conversions.signedOff, 'reviewer', 'sign_off', 'revision', 'Signed off revision 1'],
    [
      2,
      conversions.signedOff,
      'technician',
      'bench_record',
      'pin',
      'Bench, revision 1: 14 pins de-pinned or cut back, 6 tested',
    ],
    [
      4,
      conversions.draft,
      'builder',
      'create',
      'conversion',
      'Created conversion "Ashby yard truck"',
    ],
    [
      3,
      conversions.draft,
      'builder',
      'import',
      'connector',
      'Imported the pinouts of E1, E2 and E3 from the donor sheet',
    ],
    [1, conversions.draft, 'builder', 'create', 'feed', 'Added the five new feeds'],
  ];
  for (const [daysAgo, conversionId, role, action, entityType, summary] of events) {
    const actor = names[role]!;
    await AuditEvent.sequelize!.query(
      `INSERT INTO audit_events (workshop_id, conversion_id, actor_id, actor_name, action, entity_type,
         summary, created_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)`,
      {
        replacements: [
          workshopId,
          conversionId,
          actor.id,
          actor.name,
          action,
          entityType,
          summary,
          new Date(Date.now() - daysAgo * day),
        ],
        transaction,
      },
    );
  }
}
