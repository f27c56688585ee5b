import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginResponse, SetPasswordRequest } from '#shared/schemas/auth.schema.ts';
import { api } from '@/lib/api-client.ts';
import { sessionKeys } from './get-session.ts';

export const setPassword = (input: SetPasswordRequest) =>
  api.post<LoginResponse>('/api/auth/set-password', input);

export function useSetPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setPassword,
    onSuccess: ({ user }) => {
      queryClient.clear();
      queryClient.setQueryData(sessionKeys.all, user);
    },
  });
}
