/**
 * The demo's harness beyond what the pin destinations and feeds give (deriveHarness): ground points
 * where the power grounds and devices fasten, the cooling fan and fuel pump as devices with their
 * own ground wires, a splice joining two power grounds, and, in the draft, the extra chassis ground
 * on sensor ground E1-19 run through splice S-03 (the problem the checks must find).
 */
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { deriveHarness } from '../server/db/migrations/0011-harness.ts';
import { insertReturningId } from '../server/db/portable.ts';

interface Options {
  /** The draft carries the planted sensor-ground problem. */
  draft: boolean;
}

export async function seedHarness(
  sequelize: Sequelize,
  conversionId: number,
  options: Options,
  transaction: Transaction,
): Promise<void> {
  await deriveHarness(sequelize, conversionId, transaction);
  const now = new Date().toISOString();
  const q = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
    sequelize.query<T>(sql, {
      type: QueryTypes.SELECT,
      replacements: { conversionId, now, ...replacements },
      transaction,
    });
  const insert = (sql: string, replacements: Record<string, unknown>) =>
    insertReturningId(sequelize, sql, {
      replacements: { conversionId, now, ...replacements },
      transaction,
    });
  const exec = (sql: string, replacements: Record<string, unknown>) =>
    sequelize.query(sql, { replacements: { conversionId, ...replacements }, transaction });

  // Ground points.
  const ground = async (label: string, location: string, strap: number | null, notes: string) =>
    insert(
      `INSERT INTO ground_points (conversion_id, label, location, strap_size_mm2, notes, version, created_at, updated_at)
       VALUES (:conversionId, :label, :location, :strap, :notes, 0, :now, :now)`,
      { label, location, strap, notes },
    );
  const grounds: Record<string, number> = {
    'G-1': await ground('G-1', 'engine_block', 16, 'Stud on the block beside the starter.'),
    'G-2': await ground('G-2', 'chassis', 10, 'Cab ground stud behind the kick panel.'),
    'G-3': await ground('G-3', 'chassis', 6, 'Chassis rail beside the fuel tank.'),
  };
  if (options.draft) {
    grounds['G-4'] = await ground('G-4', 'chassis', 6, 'Stud on the left inner wing.');
  }

  let wireCount = (
    await q<{ n: number }>('SELECT COUNT(*) AS n FROM wires WHERE conversion_id = :conversionId')
  )[0]!.n;
  const addWire = async (
    a: { kind: string; pinId?: number; spliceId?: number; groundId?: number },
    b: { kind: string; pinId?: number; spliceId?: number; groundId?: number },
    wire: { colour: string; sizeMm2: number; lengthM: number; zone: string },
  ) => {
    wireCount += 1;
    const wireId = await insert(
      `INSERT INTO wires (conversion_id, label, colour, size_mm2, insulation_rating_c, length_m, zone, branch, notes, version, created_at, updated_at)
       VALUES (:conversionId, :label, :colour, :size, 105, :length, :zone, '', '', 0, :now, :now)`,
      {
        label: `W-${String(wireCount).padStart(3, '0')}`,
        colour: wire.colour,
        size: wire.sizeMm2,
        length: wire.lengthM,
        zone: wire.zone,
      },
    );
    for (const [index, end] of [a, b].entries()) {
      await insert(
        `INSERT INTO wire_ends (wire_id, end_index, kind, pin_id, splice_id, ground_point_id, text)
         VALUES (:wireId, :index, :kind, :pinId, :spliceId, :groundId, '')`,
        {
          wireId,
          index,
          kind: end.kind,
          pinId: end.pinId ?? null,
          spliceId: end.spliceId ?? null,
          groundId: end.groundId ?? null,
        },
      );
    }
  };

  // A destination in words that names a ground stud ("Ground stud G1, engine block") is fastened
  // to that ground point.
  const unresolved = await q<{ id: number; text: string }>(
    `SELECT e.id, e.text FROM wire_ends e JOIN wires w ON w.id = e.wire_id
      WHERE w.conversion_id = :conversionId AND e.kind = 'unresolved'`,
  );
  for (const end of unresolved) {
    const stud = /\bG(\d)\b/.exec(end.text);
    const groundId = stud ? grounds[`G-${stud[1]}`] : undefined;
    if (groundId != null) {
      await exec(
        `UPDATE wire_ends SET kind = 'ground', ground_point_id = :groundId, text = '' WHERE id = :id`,
        { groundId, id: end.id },
      );
    }
  }

  // The fan and the pump are devices: a two-cavity connector each, fed by their relay and
  // grounded on their own wire.
  const device = async (
    label: string,
    notes: string,
    loadText: RegExp,
    groundLabel: string,
    colour: string,
    sizeMm2: number,
    zone: string,
  ) => {
    const connectorId = await insert(
      `INSERT INTO connectors (conversion_id, label, side, cavity_count, rows, columns, notes, version, created_at, updated_at)
       VALUES (:conversionId, :label, 'other', 2, 1, 2, :notes, 0, :now, :now)`,
      { label, notes },
    );
    const pin = async (
      cavity: string,
      position: number,
      fn: string,
      signalClass: string,
      pinColour: string,
    ) =>
      insert(
        `INSERT INTO pins (connector_id, conversion_id, cavity, position, function, signal_class, colour, size_mm2, insulation_rating_c, disposition, destination, notes, version, created_at, updated_at)
         VALUES (:connectorId, :conversionId, :cavity, :position, :fn, :signalClass, :colour, :size, 105, 'keep', '', '', 0, :now, :now)`,
        { connectorId, cavity, position, fn, signalClass, colour: pinColour, size: sizeMm2 },
      );
    const plus = await pin('1', 0, `${notes} +`, 'power_feed', colour);
    const minus = await pin('2', 1, `${notes} −`, 'power_ground', 'BK');
    const feedEnds = await q<{ id: number; text: string }>(
      `SELECT e.id, e.text FROM wire_ends e JOIN wires w ON w.id = e.wire_id
        WHERE w.conversion_id = :conversionId AND e.kind = 'unresolved'`,
    );
    for (const end of feedEnds.filter((e) => loadText.test(e.text))) {
      await exec(`UPDATE wire_ends SET kind = 'pin', pin_id = :plus, text = '' WHERE id = :id`, {
        plus,
        id: end.id,
      });
    }
    await addWire(
      { kind: 'pin', pinId: minus },
      { kind: 'ground', groundId: grounds[groundLabel]! },
      { colour: 'BK', sizeMm2, lengthM: 0.6, zone },
    );
  };
  await device('M1', 'Cooling fan motor', /cooling fan/i, 'G-2', 'BU', 4, 'engine_bay');
  await device('P1', 'Fuel pump', /fuel pump/i, 'G-3', 'BK/YE', 4, 'cabin');

  // Two power grounds joined in splice S-01 and run to the block on one wire.
  const splice = async (label: string, notes: string) =>
    insert(
      `INSERT INTO splices (conversion_id, label, sealed, branch, distance_mm, notes, version, created_at, updated_at)
       VALUES (:conversionId, :label, TRUE, :branch, :distance, :notes, 0, :now, :now)`,
      { label, branch: 'Engine harness', distance: 350, notes },
    );
  const powerGrounds = await q<{ end_id: number }>(
    `SELECT e.id AS end_id FROM wire_ends e JOIN wires w ON w.id = e.wire_id
       JOIN pins p ON p.id = (SELECT pin_id FROM wire_ends x WHERE x.wire_id = w.id AND x.kind = 'pin' LIMIT 1)
      WHERE w.conversion_id = :conversionId AND e.kind = 'ground' AND p.signal_class = 'power_ground'
        AND e.ground_point_id = :g1 ORDER BY w.id LIMIT 2`,
    { g1: grounds['G-1'] },
  );
  if (powerGrounds.length === 2) {
    const s01 = await splice('S-01', 'Power grounds 3 and 4 joined before the block stud.');
    for (const pg of powerGrounds) {
      await exec(
        `UPDATE wire_ends SET kind = 'splice', splice_id = :s01, ground_point_id = NULL WHERE id = :id`,
        { s01, id: pg.end_id },
      );
    }
    await addWire(
      { kind: 'splice', spliceId: s01 },
      { kind: 'ground', groundId: grounds['G-1']! },
      { colour: 'BK', sizeMm2: 2.5, lengthM: 0.4, zone: 'engine_bay' },
    );
  }

  // The signals the rules read: the tach output and its gauge, the CAN pair, a shield.
  const setPin = (connector: string, cavity: string, values: Record<string, unknown>) =>
    exec(
      `UPDATE pins SET ${Object.keys(values)
        .map((k) => `${k} = :${k}`)
        .join(', ')}
        WHERE conversion_id = :conversionId AND cavity = :cavity
          AND connector_id = (SELECT id FROM connectors WHERE conversion_id = :conversionId AND label = :connector)`,
      { connector, cavity, ...values },
    );
  await setPin('E2', '12', { pulse_signal: 'open_collector', pulses_per_rev: 2 });
  // The signed-off plan's gauge has its own pull-up; the draft's expects a driven 12 V wave.
  await setPin('V1', '3', {
    pulse_signal: options.draft ? 'square_12v' : 'open_collector',
    pulses_per_rev: 2,
  });
  // The signed-off plan runs its CAN pair twisted (twist group T1); the draft has not yet.
  if (!options.draft) {
    await exec(
      `UPDATE wires SET twist_group = 'T1' WHERE conversion_id = :conversionId AND id IN (
         SELECT e.wire_id FROM wire_ends e JOIN pins p ON p.id = e.pin_id
           JOIN connectors c ON c.id = p.connector_id
          WHERE c.conversion_id = :conversionId AND c.label = 'E2' AND p.cavity IN ('15', '16'))`,
      {},
    );
  }
  if (options.draft) {
    // The ECU holds one CAN terminator; the donor's dropped gateway held the other.
    await setPin('E2', '15', { termination_ohm: 120 });
    // The crank sensor's shield drain also run to the block stud at the sensor end.
    const [shield] = await q<{ id: number }>(
      `SELECT p.id FROM pins p JOIN connectors c ON c.id = p.connector_id
        WHERE p.conversion_id = :conversionId AND c.label = 'E1' AND p.cavity = '11'`,
    );
    if (shield) {
      await addWire(
        { kind: 'pin', pinId: shield.id },
        { kind: 'ground', groundId: grounds['G-1']! },
        { colour: 'BK', sizeMm2: 0.5, lengthM: 0.8, zone: 'engine_bay' },
      );
    }
  }

  // The draft's planted problem: sensor ground E1-19 spliced at S-03 onto the inner-wing stud.
  if (options.draft) {
    const [sensor] = await q<{ end_id: number }>(
      `SELECT e.id AS end_id FROM wire_ends e JOIN wires w ON w.id = e.wire_id
         JOIN wire_ends a ON a.wire_id = w.id AND a.kind = 'pin'
         JOIN pins p ON p.id = a.pin_id JOIN connectors c ON c.id = p.connector_id
        WHERE w.conversion_id = :conversionId AND c.label = 'E1' AND p.cavity = '19'
          AND e.kind = 'unresolved'`,
    );
    if (sensor) {
      const s03 = await splice('S-03', 'Sensor ground joined to a chassis wire by the wing.');
      await exec(
        `UPDATE wire_ends SET kind = 'splice', splice_id = :s03, text = '' WHERE id = :id`,
        {
          s03,
          id: sensor.end_id,
        },
      );
      await addWire(
        { kind: 'splice', spliceId: s03 },
        { kind: 'ground', groundId: grounds['G-4']! },
        { colour: 'BN', sizeMm2: 0.5, lengthM: 0.3, zone: 'engine_bay' },
      );
    }
  }
}
