import { PageHeader } from '@/components/ui/page-header.tsx';

export function CalculatorRoute() {
  return <PageHeader title="Calculator" />;
}
