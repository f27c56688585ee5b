import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button.tsx';
import { TextAreaField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { useSubmitRevision } from '../api/revisions.ts';

interface Props {
  conversionId: number;
  checksHref: string;
  onSubmitted: (number: number) => void;
}

/** The builder freezes the plan as the next revision and sends it for review. */
export function SubmitPanel({ conversionId, checksHref, onSubmitted }: Props) {
  const submit = useSubmitRevision(conversionId);
  const [note, setNote] = useState('');
  const refusal =
    submit.error instanceof ApiError && submit.error.status === 422 ? submit.error : null;
  const reasons = (Array.isArray(refusal?.details) ? refusal.details : []) as Array<{
    message: string;
  }>;

  return (
    <section
      aria-labelledby="submit-heading"
      className="rounded-lg border border-rule bg-paper-raised p-5"
    >
      <h2 id="submit-heading" className="text-lg font-semibold">
        Submit for review
      </h2>
      <p className="mt-1 max-w-2xl text-sm text-ink-soft">
        Freezes the pin map, feeds and check findings as the next revision. A reviewer other than
        you signs it off before anyone cuts a wire. Every pin must be decided and no check may
        report an error.
      </p>
      <div className="mt-4 max-w-2xl">
        <TextAreaField
          label="Note for the reviewer (optional)"
          value={note}
          maxLength={2000}
          onChange={(e) => setNote(e.target.value)}
        />
      </div>
      {refusal ? (
        <div className="mt-4 max-w-3xl">
          <Notice tone="fault" title={refusal.message}>
            <ul className="list-disc pl-5">
              {reasons.map((r, i) => (
                <li key={i}>{r.message}</li>
              ))}
            </ul>
            <p className="mt-2">
              <Link className="underline" to={checksHref}>
                Open the checks
              </Link>
            </p>
          </Notice>
        </div>
      ) : submit.error ? (
        <div className="mt-4 max-w-3xl">
          <Notice tone="fault" title="Not submitted">
            {submit.error.message}
          </Notice>
        </div>
      ) : null}
      <div className="mt-4">
        <Button
          variant="primary"
          busy={submit.isPending}
          onClick={() =>
            submit.mutate(note ? { note } : {}, { onSuccess: (r) => onSubmitted(r.number) })
          }
        >
          Submit for review
        </Button>
      </div>
    </section>
  );
}
