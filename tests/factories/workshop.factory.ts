import bcrypt from 'bcryptjs';
import type { Role } from '#shared/auth/roles.ts';
import { Conversion, User, Workshop } from '#server/db/models/index.ts';
import { signSessionToken } from '#server/modules/auth/tokens.ts';

let counter = 0;

/** Another workshop with one user per role and one conversion: for cross-workshop checks. */
export async function createOtherWorkshop(password = 'another-workshop-pass') {
  counter += 1;
  const workshop = await Workshop.create({ name: `Other Works ${counter}` });
  const passwordHash = await bcrypt.hash(password, 10);
  const users = {} as Record<Role, User>;
  for (const role of ['admin', 'builder', 'technician', 'reviewer'] as Role[]) {
    users[role] = await User.create({
      workshopId: workshop.id,
      email: `${role}${counter}@other.example.com`,
      name: `Other ${role} ${counter}`,
      role,
      passwordHash,
    });
  }
  const conversion = await Conversion.create({
    workshopId: workshop.id,
    name: 'Other shop job',
    donorEngine: 'KT-20',
    receivingVehicle: 'Corran 100',
    systemVoltage: 12,
    createdById: users.builder.id,
  });
  return {
    workshop,
    users,
    conversion,
    password,
    authFor: (role: Role) => `Bearer ${signSessionToken(users[role].id, users[role].tokenVersion)}`,
  };
}
