import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCreateKit } from '../api/create-kit';
import type { KitView } from '../../../../shared/assets/views';
import { useUpdateKit } from '../api/update-kit';

const schema = Yup.object({
  name: Yup.string().trim().required('Give the kit a name people will recognise, e.g. “Tracker kit B”.').max(80, 'Keep the name to 80 characters.'),
  notes: Yup.string().trim().max(2000, 'Keep the notes under 2000 characters.'),
});

/** New kit (no `kit`) or rename an existing one. */
export function KitFormDialog({ open, kit, onClose, onSaved }: { open: boolean; kit?: KitView; onClose: () => void; onSaved: (kit: KitView) => void }) {
  const create = useCreateKit();
  const update = useUpdateKit();
  const [problem, setProblem] = useState<string>();
  const close = () => {
    setProblem(undefined);
    onClose();
  };
  return (
    <Dialog
      open={open}
      onClose={close}
      title={kit ? `Rename ${kit.name}` : 'New kit'}
      description={kit ? undefined : 'A kit is a set of items that travel together. Add its members on the next page.'}
    >
      <Formik
        initialValues={{ name: kit?.name ?? '', notes: kit?.notes ?? '' }}
        validationSchema={schema}
        onSubmit={async (values, helpers) => {
          setProblem(undefined);
          try {
            const notes = values.notes.trim() || null;
            const saved = kit
              ? await update.mutateAsync({ id: kit.id, changes: { name: values.name.trim(), notes } })
              : await create.mutateAsync({ name: values.name.trim(), notes: notes ?? undefined });
            setProblem(undefined);
            onSaved(saved);
          } catch (error) {
            setProblem(applyServerErrors(error, helpers, { fields: ['name', 'notes'], labels: { name: 'The name', notes: 'The notes' } }));
          }
        }}
      >
        {({ isSubmitting }) => (
          <Form noValidate className="flex flex-col gap-4">
            {problem ? (
              <Notice tone="error" title="Not saved">
                {problem}
              </Notice>
            ) : null}
            <Field name="name" label="Kit name" autoComplete="off" />
            <Field name="notes" label="Notes" autoComplete="off" hint="Optional, e.g. what the kit is usually used for." />
            <div className="flex flex-wrap justify-end gap-2">
              <Button onClick={close}>Cancel</Button>
              <Button type="submit" variant="primary" busy={isSubmitting}>
                {kit ? 'Save name' : 'Create kit'}
              </Button>
            </div>
          </Form>
        )}
      </Formik>
    </Dialog>
  );
}
