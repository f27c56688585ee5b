import { PageHeader } from '@/components/ui/page-header.tsx';
import { HelpScreen } from '@/features/help/components/help-screen.tsx';
import { GRID_SHORTCUTS } from '@/features/pin-map/lib/shortcuts.ts';

export function HelpRoute() {
  return (
    <>
      <PageHeader title="Help" kicker="Loomwright">
        How the work goes from pin map to bench, the keys of the pin grid, what the words mean, and
        every rule the checks apply with its source.
      </PageHeader>
      <HelpScreen shortcuts={GRID_SHORTCUTS} />
    </>
  );
}
