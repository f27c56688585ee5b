import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginRequest, LoginResponse } from '#shared/schemas/auth.schema.ts';
import { api } from '@/lib/api-client.ts';
import { sessionKeys } from './get-session.ts';

export const signIn = (input: LoginRequest) => api.post<LoginResponse>('/api/auth/login', input);

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => {
      // A new person may be signing in: nothing cached for the last one may show.
      queryClient.clear();
      queryClient.setQueryData(sessionKeys.all, user);
    },
  });
}
