import autocannon from 'autocannon';

export interface LoadResult {
  requestsPerSec: number;
  p99Ms: number;
  errors: number;
}

/**
 * Drives `url` with `connections` concurrent clients for `seconds` from this process, while the
 * server runs in another. `during` is called every 100 ms while the load runs (memory sampling).
 */
export async function load(
  url: string,
  headers: Record<string, string>,
  {
    connections = 20,
    seconds = 3,
    during,
  }: { connections?: number; seconds?: number; during?: () => void } = {},
): Promise<LoadResult> {
  const sampler = during ? setInterval(during, 100) : null;
  try {
    const result = await autocannon({ url, connections, duration: seconds, headers });
    return {
      requestsPerSec: result.requests.average,
      p99Ms: result.latency.p99,
      errors: result.errors + result.non2xx + result.timeouts,
    };
  } finally {
    if (sampler) clearInterval(sampler);
  }
}
