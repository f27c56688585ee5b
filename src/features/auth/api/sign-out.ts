import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client.ts';
import { sessionKeys } from './get-session.ts';

export const signOut = () => api.post<void>('/api/auth/logout');

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      queryClient.clear();
      queryClient.setQueryData(sessionKeys.all, null);
    },
  });
}
