/**
 * Route loaders that fill the query cache before a page draws: every query the page needs starts
 * at once, alongside the page's own code, instead of one after another as each component mounts
 * and finds what it needs. The components keep reading through their hooks, and find the data
 * there.
 */
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { getSessionQueryOptions } from '@/features/auth/api/get-session.ts';
import { getConversionQueryOptions } from '@/features/conversions/api/get-conversion.ts';
import { getFeedsQueryOptions } from '@/features/feeds/api/get-feeds.ts';
import { getConnectorsQueryOptions } from '@/features/pin-map/api/get-connectors.ts';
import { getPinsQueryOptions } from '@/features/pin-map/api/get-pins.ts';
import {
  getRevisionQueryOptions,
  getRevisionsQueryOptions,
} from '@/features/revisions/api/revisions.ts';
import { getWorkshopQueryOptions } from '@/features/workshop/api/workshop.ts';

/**
 * Waits for all of them, failed or not: a page shows its own message for a query that failed (a
 * missing conversion, a revision that does not match its seal), as it did before loaders, rather
 * than the router's error page.
 */
async function settle(...loads: Array<Promise<unknown>>): Promise<null> {
  await Promise.allSettled(loads);
  return null;
}

const conversionIdOf = (params: LoaderFunctionArgs['params']) => Number(params.conversionId);

export function conversionLoaders(queryClient: QueryClient) {
  const ensure = queryClient.ensureQueryData.bind(queryClient);
  /** The plan's lists: connectors, pins and feeds, which the overview, pin map and feeds show. */
  const plan = (id: number) => [
    ensure(getConnectorsQueryOptions(id)),
    ensure(getPinsQueryOptions(id)),
    ensure(getFeedsQueryOptions(id)),
  ];
  return {
    /** The frame of every conversion page; the workshop's settings most sections need. */
    conversion: ({ params }: LoaderFunctionArgs) =>
      settle(
        ensure(getConversionQueryOptions(conversionIdOf(params))),
        ensure(getWorkshopQueryOptions()),
      ),

    overview: ({ params }: LoaderFunctionArgs) =>
      settle(
        ...plan(conversionIdOf(params)),
        ensure(getRevisionsQueryOptions(conversionIdOf(params))),
      ),

    pinMap: ({ params }: LoaderFunctionArgs) => settle(...plan(conversionIdOf(params))),

    // Not the check report: it is run afresh whenever a page showing findings opens (staleTime
    // 0), so filling it here would run the checks twice.
    feeds: ({ params }: LoaderFunctionArgs) => settle(...plan(conversionIdOf(params))),

    // The bench sheet waits: it is asked for only once the revision shows it is signed off.
    revision: ({ params }: LoaderFunctionArgs) =>
      settle(
        ensure(getRevisionQueryOptions(conversionIdOf(params), Number(params.number))),
        ensure(getSessionQueryOptions()),
      ),
  };
}
