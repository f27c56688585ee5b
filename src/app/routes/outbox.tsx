import { PageHeader } from '@/components/ui/page-header.tsx';
import { OutboxView } from '@/features/mail/components/outbox-view.tsx';

export function OutboxRoute() {
  return (
    <>
      <PageHeader title="Mail" kicker="Admin">
        Review requests, sign-offs, send-backs and invitations go out through this queue, and are
        retried if the mail server is down.
      </PageHeader>
      <OutboxView />
    </>
  );
}
