import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { useHoldAsset } from '../api/hold-asset';
import { releaseRule, tipPositionsOf, type HeldAsset } from './hold-words';

const schema = Yup.object({
  summary: Yup.string().trim().required('Say why the item is held.').min(3, 'Say why — a few words at least.').max(500, 'Keep it under 500 characters.'),
});

/** "Put on hold": a button and its dialog asking for the reason. */
export function PutOnHoldButton({ asset, className = '' }: { asset: HeldAsset; className?: string }) {
  const { id: assetId, assetTag } = asset;
  const [open, setOpen] = useState(false);
  const [problem, setProblem] = useState<string>();
  const hold = useHoldAsset();
  const close = () => {
    setProblem(undefined);
    setOpen(false);
  };
  return (
    <>
      <Button variant="danger" className={className} onClick={() => setOpen(true)}>
        Put on hold
      </Button>
      <Dialog
        open={open}
        onClose={close}
        title={`Put ${assetTag} on hold`}
        description={`A held item cannot be booked or sent out. ${releaseRule(asset.type, tipPositionsOf(asset.specs))}`}
      >
        <Formik
          initialValues={{ summary: '' }}
          validationSchema={schema}
          onSubmit={async (values, helpers) => {
            setProblem(undefined);
            try {
              await hold.mutateAsync({ assetId, summary: values.summary.trim() });
              close();
            } catch (error) {
              setProblem(applyServerErrors(error, helpers, { fields: ['summary'], labels: { summary: 'The reason' } }));
            }
          }}
        >
          {({ isSubmitting }) => (
            <Form noValidate className="flex flex-col gap-4">
              {problem ? (
                <Notice tone="error" title="Not held">
                  {problem}
                </Notice>
              ) : null}
              <Field name="summary" label="Reason" hint="E.g. readings drifting, case arrived open, awaiting inspection." autoComplete="off" />
              <div className="flex flex-wrap justify-end gap-2">
                <Button onClick={close}>Cancel</Button>
                <Button type="submit" variant="danger" busy={isSubmitting}>
                  Hold the item
                </Button>
              </div>
            </Form>
          )}
        </Formik>
      </Dialog>
    </>
  );
}
