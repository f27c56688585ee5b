import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionUser } from '#shared/schemas/auth.schema.ts';
import { api, ApiError } from '@/lib/api-client.ts';

export const sessionKeys = { all: ['session'] as const };

/** The signed-in user, or null when there is no valid session. */
export async function getSession(): Promise<SessionUser | null> {
  try {
    const { user } = await api.get<{ user: SessionUser }>('/api/auth/me');
    return user;
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export const getSessionQueryOptions = () =>
  queryOptions({ queryKey: sessionKeys.all, queryFn: getSession, staleTime: 5 * 60_000 });

export const useSession = () => useQuery(getSessionQueryOptions());
