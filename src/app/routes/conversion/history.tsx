import { useOutletContext } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { Notice } from '@/components/ui/notice.tsx';
import { AuditTrail } from '@/features/audit/components/audit-trail.tsx';
import { useCan } from '@/features/auth/hooks/use-can.ts';

export function ConversionHistoryRoute() {
  const conversion = useOutletContext<Conversion>();
  const mayRead = useCan('audit:read');
  if (!mayRead) {
    return (
      <Notice tone="caution" title="Not available to your role">
        The history is kept for builders, reviewers and the admin.
      </Notice>
    );
  }
  return <AuditTrail conversionId={conversion.id} />;
}
