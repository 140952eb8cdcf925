import { Form, Formik } from 'formik';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import type { OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';

const schema = Yup.object({
  mailReplyTo: Yup.string()
    .trim()
    .email('Give an e-mail address, such as office@yourfirm.example, or leave it empty.')
    .max(254, 'Keep it under 254 characters.'),
});

/** Where replies to the firm's mail go (owner only). Every mail already carries the firm's name and address. */
export function MailForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();
  return (
    <Formik
      initialValues={{ mailReplyTo: settings.mailReplyTo ?? '' }}
      validationSchema={schema}
      enableReinitialize
      onSubmit={(values, helpers) => save({ mailReplyTo: values.mailReplyTo.trim() }, helpers, { fields: ['mailReplyTo'] })}
    >
      {({ isSubmitting, dirty }) => (
        <Form noValidate aria-label="Mail" className="flex max-w-xl flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
          {saved ? <Notice tone="success">Saved.</Notice> : null}
          {problem ? (
            <Notice tone="error" title="Not saved">
              {problem}
            </Notice>
          ) : null}
          <p className="text-sm text-ink-700">Mail goes out in the name of {settings.name}, signed with the address under Invoice details.</p>
          <Field
            name="mailReplyTo"
            type="email"
            label="Replies go to"
            hint="The address a customer's or colleague's reply reaches, such as your office. Leave it empty and replies go to the sending address, which nobody reads."
            autoComplete="email"
          />
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting} disabled={!dirty}>
              Save mail settings
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
