import type { ReactNode } from 'react';
import { NavLink, Outlet, useParams } from 'react-router-dom';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { useConversion } from '@/features/conversions/api/get-conversion.ts';
import { ApiError } from '@/lib/api-client.ts';

function SectionLink({ to, end, children }: { to: string; end?: boolean; children: ReactNode }) {
  return (
    <NavLink
      to={to}
      end={end}
      className={({ isActive }) =>
        `-mb-px border-b-2 px-3 py-2 text-[0.9375rem] font-medium ${
          isActive
            ? 'border-copper text-ink'
            : 'border-transparent text-ink-soft hover:border-rule-strong hover:text-ink'
        }`
      }
    >
      {children}
    </NavLink>
  );
}

/** The frame of every conversion page: its name, donor → vehicle, and the section tabs. */
export function ConversionLayout() {
  const { conversionId } = useParams();
  const id = Number(conversionId);
  const conversion = useConversion(id);

  if (conversion.isPending) return <Loading what="Loading the conversion" />;
  if (conversion.isError) {
    const missing = conversion.error instanceof ApiError && conversion.error.status === 404;
    return (
      <Notice
        tone="fault"
        title={
          missing ? 'No such conversion in this workshop' : 'The conversion could not be loaded'
        }
      >
        {conversion.error.message}
      </Notice>
    );
  }
  const c = conversion.data;
  return (
    <>
      <header className="mb-4">
        <p className="mb-1 text-xs font-semibold uppercase tracking-[0.14em] text-copper-deep">
          Conversion
        </p>
        <h1 className="text-2xl font-semibold">{c.name}</h1>
        <p className="mt-1 text-ink-soft">
          <span>{c.donorEngine}</span>
          <span aria-hidden className="mx-2 text-copper">
            →
          </span>
          <span className="sr-only"> into </span>
          <span>{c.receivingVehicle}</span>
          <span className="ml-3 rounded border border-rule-strong px-1.5 py-0.5 font-mono text-xs">
            {c.systemVoltage} V
          </span>
        </p>
      </header>
      <nav
        aria-label="Conversion sections"
        className="mb-6 flex flex-wrap gap-1 border-b border-rule print:hidden"
      >
        <SectionLink to={paths.conversion.getHref(id)} end>
          Overview
        </SectionLink>
        <SectionLink to={paths.conversionPins.getHref(id)}>Pin map</SectionLink>
        <SectionLink to={paths.conversionFeeds.getHref(id)}>Feeds</SectionLink>
        <SectionLink to={paths.conversionWires.getHref(id)}>Wires</SectionLink>
        <SectionLink to={paths.conversionBox.getHref(id)}>Box</SectionLink>
        <SectionLink to={paths.conversionChecks.getHref(id)}>Checks</SectionLink>
        <SectionLink to={paths.conversionRevisions.getHref(id)}>Revisions</SectionLink>
        <SectionLink to={paths.conversionBench.getHref(id)}>Bench</SectionLink>
        <SectionLink to={paths.conversionFiles.getHref(id)}>Import &amp; files</SectionLink>
        <SectionLink to={paths.conversionHistory.getHref(id)}>History</SectionLink>
      </nav>
      <Outlet context={c} />
    </>
  );
}
