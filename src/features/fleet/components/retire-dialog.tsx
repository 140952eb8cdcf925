import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { useRetireAsset } from '../api/retire-asset';
import type { AssetView } from '../../../../shared/assets/views';

const schema = Yup.object({
  reason: Yup.string()
    .trim()
    .required('Say briefly why the item leaves the fleet.')
    .min(3, 'Say briefly why — a few words at least.')
    .max(500, 'Keep the reason under 500 characters.'),
});

/** Retiring keeps the record and its history; the item can no longer be edited or booked. */
export function RetireDialog({ asset, open, onClose, onRetired }: { asset: AssetView; open: boolean; onClose: () => void; onRetired?: () => void }) {
  const retire = useRetireAsset();
  const [problem, setProblem] = useState<string>();
  return (
    <Dialog
      open={open}
      onClose={() => {
        setProblem(undefined);
        onClose();
      }}
      title={`Retire ${asset.assetTag}`}
      description="A retired item stays on record with its history and equipment record, but can no longer be edited, booked or sent out. This cannot be undone here."
    >
      <Formik
        initialValues={{ reason: '' }}
        validationSchema={schema}
        onSubmit={async (values, helpers) => {
          setProblem(undefined);
          try {
            await retire.mutateAsync({ id: asset.id, reason: values.reason.trim() });
            onRetired?.();
            onClose();
          } catch (error) {
            setProblem(applyServerErrors(error, helpers, { fields: ['reason'], labels: { reason: 'The reason' } }));
          }
        }}
      >
        {({ isSubmitting }) => (
          <Form noValidate className="flex flex-col gap-4">
            {problem ? (
              <Notice tone="error" title="Not retired">
                {problem}
              </Notice>
            ) : null}
            <Field name="reason" label="Reason" hint="E.g. sold, written off after damage, lost on site." autoComplete="off" />
            <div className="flex flex-wrap justify-end gap-2">
              <Button onClick={onClose}>Cancel</Button>
              <Button type="submit" variant="danger" busy={isSubmitting}>
                Confirm retirement
              </Button>
            </div>
          </Form>
        )}
      </Formik>
    </Dialog>
  );
}
