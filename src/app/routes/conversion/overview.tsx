import { useParams } from 'react-router';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { PageHeader } from '@/components/ui/page-header.tsx';
import { useConversion } from '@/features/conversions/api/get-conversion.ts';
import { ApiError } from '@/lib/api-client.ts';

export function ConversionRoute() {
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
      <PageHeader title={c.name} kicker="Conversion">
        <span>{c.donorEngine}</span>
        <span aria-hidden className="mx-2 text-copper">
          →
        </span>
        <span>{c.receivingVehicle}</span>
        <span className="ml-3 rounded border border-rule-strong px-1.5 py-0.5 font-mono text-xs">
          {c.systemVoltage} V
        </span>
      </PageHeader>
      <section
        aria-labelledby="notes-heading"
        className="max-w-3xl rounded-lg border border-rule bg-paper-raised p-5"
      >
        <h2 id="notes-heading" className="mb-2 font-semibold">
          Notes
        </h2>
        <p className="whitespace-pre-wrap text-ink-soft">{c.notes || 'No notes.'}</p>
        <p className="mt-4 text-sm text-ink-faint">
          Started by {c.createdBy?.name ?? 'someone no longer here'} · last changed{' '}
          {new Date(c.updatedAt).toLocaleString()}
        </p>
      </section>
    </>
  );
}
