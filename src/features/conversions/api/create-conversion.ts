import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Conversion, CreateConversionRequest } from '#shared/schemas/conversions.schema.ts';
import { api } from '@/lib/api-client.ts';
import { conversionKeys } from './keys.ts';

export const createConversion = (input: CreateConversionRequest) =>
  api.post<{ conversion: Conversion }>('/api/conversions', input);

export function useCreateConversion() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createConversion,
    onSuccess: ({ conversion }) => {
      queryClient.setQueryData(conversionKeys.detail(conversion.id), conversion);
      return queryClient.invalidateQueries({ queryKey: conversionKeys.lists() });
    },
  });
}
