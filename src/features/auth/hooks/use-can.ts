import { can, type Right } from '#shared/auth/roles.ts';
import { useSession } from '../api/get-session.ts';

/** Whether the signed-in user's role holds `right` (the same table the server enforces). */
export function useCan(right: Right): boolean {
  const { data: user } = useSession();
  return can(user?.role, right);
}
