import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { PageHeader } from '@/components/ui/page-header.tsx';
import { CalculatorScreen } from '@/features/calculator/components/calculator-screen.tsx';
import { useWorkshop } from '@/features/workshop/api/workshop.ts';

/** What-ifs for one circuit, for anyone signed in; starts from the workshop's unit and voltage. */
export function CalculatorRoute() {
  const workshop = useWorkshop();
  return (
    <>
      <PageHeader title="Circuit calculator" kicker="What-if">
        Voltage drop, wire ampacity and fuse sizing for one load on one run of wire, with the
        working and the published sources. Local codes and licensed practice prevail.
      </PageHeader>
      {workshop.isPending ? (
        <Loading what="Loading the workshop settings" />
      ) : workshop.isError ? (
        <Notice tone="fault" title="The workshop settings could not be loaded">
          {workshop.error.message}
        </Notice>
      ) : (
        <CalculatorScreen workshop={workshop.data} />
      )}
    </>
  );
}
