import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  CreateUserRequest,
  UpdateUserRequest,
  UserSummary,
} from '#shared/schemas/users.schema.ts';
import { api } from '@/lib/api-client.ts';

export const userKeys = {
  all: ['users'] as const,
  lists: () => [...userKeys.all, 'list'] as const,
};

export const getUsers = () => api.get<{ users: UserSummary[] }>('/api/users');

export const getUsersQueryOptions = () =>
  queryOptions({ queryKey: userKeys.lists(), queryFn: async () => (await getUsers()).users });

export const useUsers = () => useQuery(getUsersQueryOptions());

export const createUser = (input: CreateUserRequest) =>
  api.post<{ user: UserSummary }>('/api/users', input);

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}

export const updateUser = ({ id, ...input }: UpdateUserRequest & { id: number }) =>
  api.patch<{ user: UserSummary }>(`/api/users/${id}`, input);

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}
