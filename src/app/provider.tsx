import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { useState, type ReactNode } from 'react';
import { registerBenchMutations } from '@/features/bench/api/bench.ts';
import { createQueryClient } from '@/lib/query-client.ts';

/**
 * Writes queued while the tablet is offline are kept in the browser's storage, so a reload or a
 * flat battery does not lose them; they are sent once the app is back and online. Only paused
 * writes are stored, never the data read from the server.
 */
const persister = createAsyncStoragePersister({
  storage: typeof window === 'undefined' ? undefined : window.localStorage,
  key: 'loomwright-queued-writes',
});

function createAppQueryClient() {
  const queryClient = createQueryClient();
  registerBenchMutations(queryClient);
  return queryClient;
}

export function AppProvider({ children }: { children: ReactNode }) {
  const [queryClient] = useState(createAppQueryClient);
  return (
    <PersistQueryClientProvider
      client={queryClient}
      persistOptions={{
        persister,
        maxAge: 7 * 24 * 3_600_000,
        dehydrateOptions: {
          shouldDehydrateQuery: () => false,
          shouldDehydrateMutation: (m) => m.state.isPaused,
        },
      }}
      onSuccess={() => void queryClient.resumePausedMutations()}
    >
      {children}
    </PersistQueryClientProvider>
  );
}
