import { Form, Formik } from 'formik';
import { Button } from '../../../components/button';
import { CheckboxField } from '../../../components/field';
import { Notice } from '../../../components/notice';
import type { OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';
import { ReportUnsaved } from './unsaved-changes';

/** Whether the roles that move money must sign in with a second step. */
export function SignInPolicyForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();
  return (
    <Formik
      initialValues={{ secondStepRequired: settings.secondStepRequired }}
      enableReinitialize
      onSubmit={(values, helpers) => save({ secondStepRequired: values.secondStepRequired }, helpers, { fields: ['secondStepRequired'] })}
    >
      {({ isSubmitting, dirty }) => (
        <Form noValidate aria-label="Sign-in rules" className="flex max-w-xl flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
          <ReportUnsaved section="Sign-in rules" />
          {saved ? <Notice tone="success">Saved.</Notice> : null}
          {problem ? (
            <Notice tone="error" title="Not saved">
              {problem}
            </Notice>
          ) : null}
          <CheckboxField
            name="secondStepRequired"
            label="Owners and billing clerks must sign in with a second step"
            hint="They move money, so a stolen password alone should not be enough. Anyone in these roles without a second step is asked to set it up (a phone app that shows codes) before anything else. Others may turn it on for themselves."
          />
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting} disabled={!dirty}>
              Save sign-in rules
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
