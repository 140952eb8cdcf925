import { Form, Formik } from 'formik';
import { useId, useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { currencyDigits } from '../../../lib/format';
import { parseAmount } from '../../../lib/money';
import { useUpdateIncident } from '../api/update-incident';
import type { IncidentView } from '../../../../shared/incidents/views';

/** "Start review" and "Resolve" for those who review incidents. A resolved incident is closed. */
export function ReviewActions({ incident, currency }: { incident: IncidentView; currency: string }) {
  const update = useUpdateIncident();
  const [resolving, setResolving] = useState(false);
  if (incident.state === 'resolved') return <p className="text-sm text-ink-700">This incident is resolved; its record is closed.</p>;
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap gap-2">
        {incident.state === 'reported' ? (
          <Button variant="secondary" className="min-h-11" busy={update.isPending} onClick={() => update.mutate({ id: incident.id, state: 'reviewing' })}>
            Start review
          </Button>
        ) : null}
        <Button variant="primary" className="min-h-11" onClick={() => setResolving(true)}>
          Resolve
        </Button>
      </div>
      {update.isError && !resolving ? <Notice tone="error">{update.error.message}</Notice> : null}
      <ResolveDialog incident={incident} currency={currency} open={resolving} onClose={() => setResolving(false)} />
    </div>
  );
}

function ResolveDialog({ incident, currency, open, onClose }: { incident: IncidentView; currency: string; open: boolean; onClose: () => void }) {
  const update = useUpdateIncident();
  const [problem, setProblem] = useState<string>();
  const digits = currencyDigits(currency);
  const formId = useId();
  const schema = Yup.object({
    resolution: Yup.string().trim().required('Say how it was resolved.').max(4000, 'Keep it under 4,000 characters.'),
    charge: Yup.string().test(
      'amount',
      `Enter an amount in ${currency}, e.g. ${(120).toFixed(digits)}, or leave it empty.`,
      (v) => !v?.trim() || parseAmount(v, digits) !== null,
    ),
  });
  return (
    <Dialog
      open={open}
      onClose={() => {
        setProblem(undefined);
        onClose();
      }}
      title="Resolve the incident"
      description="Say what was done (repaired, recalibrated, written off, found). Resolving closes the record; the item itself stays on hold until it is released on evidence."
    >
      <Formik
        initialValues={{ resolution: incident.resolution ?? '', charge: '' }}
        validationSchema={schema}
        onSubmit={async (values, helpers) => {
          setProblem(undefined);
          const charge = values.charge.trim() ? parseAmount(values.charge, digits) : null;
          try {
            await update.mutateAsync({
              id: incident.id,
              state: 'resolved',
              resolution: values.resolution.trim(),
              ...(charge !== null ? { chargeAmountMinor: charge } : {}),
            });
            onClose();
          } catch (error) {
            setProblem(
              applyServerErrors(error, helpers, {
                fields: ['resolution', 'charge'],
                aliases: { chargeAmountMinor: 'charge' },
                labels: { resolution: 'The resolution', charge: 'The charge' },
              }),
            );
          }
        }}
      >
        {({ isSubmitting }) => (
          <Form noValidate id={formId} className="flex flex-col gap-4">
            {problem ? (
              <Notice tone="error" title="Not resolved">
                {problem}
              </Notice>
            ) : null}
            <Field name="resolution" label="Resolution" autoComplete="off" />
            <Field
              name="charge"
              label={`Charge (${currency})`}
              inputMode="decimal"
              autoComplete="off"
              hint="Optional: what the customer or renter is charged for it."
            />
            <div className="flex flex-wrap justify-end gap-2">
              <Button onClick={onClose}>Cancel</Button>
              <Button type="submit" variant="primary" busy={isSubmitting}>
                Mark resolved
              </Button>
            </div>
          </Form>
        )}
      </Formik>
    </Dialog>
  );
}
