import { PageHeader } from '@/components/ui/page-header.tsx';

export function LibraryRoute() {
  return <PageHeader title="Library" />;
}
