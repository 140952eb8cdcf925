import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { isApiError } from '../../../lib/api-client';
import { useConfirmSecondStep, useRefreshSession, useStartSecondStep } from '../api/second-step';
import type { SecondStepEnrolmentView } from '../../../../shared/auth/views';

const codeSchema = Yup.object({
  code: Yup.string()
    .trim()
    .required('Enter the 6 digits your app shows.')
    .matches(/^\d{6}$/, 'Use the 6 digits your app shows.'),
});

/** Scan, confirm a code, keep the recovery codes: three steps on one card. */
export function SecondStepSetup({ onCancel }: { onCancel?: () => void }) {
  const start = useStartSecondStep();
  const confirm = useConfirmSecondStep();
  const refresh = useRefreshSession();
  const [enrolment, setEnrolment] = useState<SecondStepEnrolmentView>();
  const [recoveryCodes, setRecoveryCodes] = useState<string[]>();
  const [problem, setProblem] = useState<string>();

  if (recoveryCodes) {
    return (
      <div className="flex flex-col gap-3">
        <Notice tone="success" title="The second step is on">
          From now on Nestkeeper asks for a code from your app after your password.
        </Notice>
        <h3 className="font-bold">Your recovery codes</h3>
        <p className="text-sm text-ink-700">
          Keep these somewhere safe, away from your phone (printed, or in a password manager). Each one signs you in once if the phone is lost. They are shown
          only now.
        </p>
        <ul aria-label="Recovery codes" className="grid grid-cols-2 gap-2 rounded-md border border-paper-line bg-paper p-3 font-mono text-base sm:grid-cols-5">
          {recoveryCodes.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
        <div>
          <Button variant="primary" onClick={() => void refresh()}>
            I have kept them safe
          </Button>
        </div>
      </div>
    );
  }

  if (!enrolment) {
    return (
      <div className="flex flex-col gap-3">
        {problem ? <Notice tone="error">{problem}</Notice> : null}
        <p className="text-sm text-ink-700">
          You need an authenticator app on your phone (any app that reads time-based codes, RFC 6238). Nestkeeper shows a QR code; the app then shows a new
          6-digit code every 30 seconds.
        </p>
        <div className="flex flex-wrap gap-2">
          <Button
            variant="primary"
            busy={start.isPending}
            onClick={async () => {
              setProblem(undefined);
              try {
                setEnrolment(await start.mutateAsync());
              } catch (error) {
                setProblem(isApiError(error) ? error.message : 'Something went wrong. Try again.');
              }
            }}
          >
            Set up the second step
          </Button>
          {onCancel ? <Button onClick={onCancel}>Not now</Button> : null}
        </div>
      </div>
    );
  }

  return (
    <Formik
      initialValues={{ code: '' }}
      validationSchema={codeSchema}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        try {
          setRecoveryCodes((await confirm.mutateAsync(values.code.trim())).recoveryCodes);
        } catch (error) {
          setProblem(applyServerErrors(error, helpers, { fields: ['code'] }));
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate aria-label="Confirm the second step" className="flex flex-col gap-4">
          <div className="flex flex-col gap-4 sm:flex-row sm:items-start">
            <img
              src={enrolment.qrDataUrl}
              alt="QR code to scan with your authenticator app"
              width={200}
              height={200}
              className="self-center rounded border border-paper-line bg-white"
            />
            <div className="flex min-w-0 flex-col gap-2 text-sm text-ink-700">
              <p>1. In your authenticator app, add an account and scan this code.</p>
              <p>
                Cannot scan? Type this key instead:
                <span data-testid="second-step-secret" className="mt-1 block font-mono text-base break-all text-ink-900">
                  {enrolment.secret}
                </span>
              </p>
              <p>2. Type the 6 digits the app now shows for Nestkeeper.</p>
            </div>
          </div>
          {problem ? (
            <Notice tone="error" title="Not turned on">
              {problem}
            </Notice>
          ) : null}
          <Field name="code" label="Code from the app" autoComplete="one-time-code" inputMode="numeric" mono className="max-w-xs" />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" variant="primary" busy={isSubmitting}>
              Confirm and turn on
            </Button>
            {onCancel ? <Button onClick={onCancel}>Cancel</Button> : null}
          </div>
        </Form>
      )}
    </Formik>
  );
}
