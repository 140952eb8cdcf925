import { Form, Formik } from 'formik';
import * as Yup from 'yup';
import type { RentalView } from '../../../../shared/billing/views';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { FactList, Panel } from '../../../components/panel';
import { StatusChip } from '../../../components/status-chip';
import { applyServerErrors } from '../../../lib/form-errors';
import { useFirmFormat } from '../../../lib/format';
import { useOverrideHandover } from '../api/override-handover';

/**
 * What the counter needs before the kit goes: the renter's acceptance of the
 * agreement (from their page) and the deposit's card authorization — or the
 * owner's override with a reason.
 */
export function HandoverReadiness({ rental, canOverride }: { rental: RentalView; canOverride: boolean }) {
  const { dateTime } = useFirmFormat();
  const accepted = rental.agreement;
  const override = rental.handoverOverride;
  const open = rental.state === 'reserved';
  const ready = !!accepted && rental.deposit.state === 'authorized';
  return (
    <Panel title="Agreement and hand-over">
      <FactList
        items={[
          {
            term: 'Agreement',
            value: accepted ? <StatusChip tone="ok" label={`Accepted by ${accepted.fullName}`} /> : <StatusChip tone="paused" label="Not accepted yet" />,
          },
          ...(accepted
            ? [
                { term: 'Accepted', value: `${dateTime(accepted.acceptedAt)} from ${accepted.ipAddress}` },
                { term: 'Agreement SHA-256', value: <span className="break-all">{accepted.agreementSha256}</span>, mono: true },
              ]
            : []),
          ...(override ? [{ term: 'Owner’s override', value: `${override.reason} (${dateTime(override.at)})` }] : []),
        ]}
      />
      {!accepted && open ? (
        <p className="mt-2 text-sm text-ink-700">The renter accepts it on their own page: the link goes with the deposit request below.</p>
      ) : null}
      {canOverride && open && !ready && !override ? <OverrideForm rentalId={rental.id} /> : null}
    </Panel>
  );
}

function OverrideForm({ rentalId }: { rentalId: string }) {
  const override = useOverrideHandover();
  return (
    <Formik
      initialValues={{ reason: '' }}
      validationSchema={Yup.object({
        reason: Yup.string().trim().min(10, 'Say why the kit may go out without them (at least a few words).').required('Say why.'),
      })}
      onSubmit={async ({ reason }, helpers) => {
        try {
          await override.mutateAsync({ rentalId, reason });
        } catch (error) {
          const message = applyServerErrors(error, helpers, { fields: ['reason'] });
          if (message) helpers.setErrors({ reason: message });
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate className="mt-3 flex flex-col gap-2 border-t border-paper-line pt-3" aria-label="Owner's override">
          <Field name="reason" label="Let it go without them: reason (owner)" hint="Recorded with your name in the audit log." />
          <div>
            <Button type="submit" variant="danger" size="sm" busy={isSubmitting}>
              Override for this rental
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
