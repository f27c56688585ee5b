import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordRequest } from '#shared/schemas/auth.schema.ts';
import { api } from '@/lib/api-client.ts';

export const changePassword = (input: ChangePasswordRequest) =>
  api.post<{ token: string }>('/api/auth/password', input);

export const useChangePassword = () => useMutation({ mutationFn: changePassword });
