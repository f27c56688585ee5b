import bcrypt from 'bcryptjs';
import type { Sequelize } from 'sequelize';
import { Conversion, User, Workshop } from '../server/db/models/index.ts';
import { DEMO_CONVERSIONS, DEMO_USERS, DEMO_WORKSHOP } from './demo-data.ts';

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
 * Seeds the demo workshop in one transaction: the workshop, one user per role, and the two demo
 * conversions. Later steps add each conversion's pins, feeds and revisions.
 */
export async function seedDemo(
  sequelize: Sequelize,
  options: { password: string; bcryptCost: number },
): Promise<DemoSeedResult> {
  const passwordHash = await bcrypt.hash(options.password, options.bcryptCost);
  return sequelize.transaction(async (transaction) => {
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
    return {
      workshopId: workshop.id,
      users,
      conversions: { signedOff: signedOff.id, draft: draft.id },
    };
  });
}
