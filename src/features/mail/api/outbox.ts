import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client.ts';

export interface OutboxRow {
  id: number;
  kind: string;
  to: string;
  subject: string;
  status: 'pending' | 'sending' | 'sent' | 'failed';
  attempts: number;
  lastError: string | null;
  createdAt: string;
  sentAt: string | null;
}

export interface ReceivedMail {
  from: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

export const outboxKeys = { all: ['outbox'] as const };

export const getOutbox = () =>
  api.get<{ outbox: OutboxRow[]; received: ReceivedMail[] | null }>('/api/admin/outbox');

export const getOutboxQueryOptions = () =>
  queryOptions({ queryKey: outboxKeys.all, queryFn: getOutbox, refetchInterval: 5000 });

export const useOutbox = () => useQuery(getOutboxQueryOptions());
