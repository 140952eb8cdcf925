import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { StatusChip } from '../../../components/status-chip';
import { applyServerErrors } from '../../../lib/form-errors';
import { useTurnOffSecondStep } from '../api/second-step';
import { SecondStepSetup } from './second-step-setup';
import { useSession } from './session-context';

/** "My account": whether the second step is on, turning it on, and off again with the password (unless the firm requires it). */
export function SecondStepPanel() {
  const { secondStep } = useSession();
  const turnOff = useTurnOffSecondStep();
  const [settingUp, setSettingUp] = useState(false);
  const [turningOff, setTurningOff] = useState(false);
  const [problem, setProblem] = useState<string>();

  return (
    <div className="flex flex-col gap-3">
      <p className="flex flex-wrap items-center gap-2">
        <StatusChip tone={secondStep.on ? 'ok' : 'none'} label={secondStep.on ? 'On' : 'Off'} />
        <span className="text-sm text-ink-700">
          {secondStep.on
            ? `After your password, Nestkeeper asks for a code from your app. Recovery codes left: ${secondStep.recoveryCodesLeft} of 10.`
            : 'A code from an app on your phone, asked for after your password: a stolen password alone is then not enough.'}
          {secondStep.requiredForRole ? ' Your firm requires it for your role.' : ''}
        </span>
      </p>
      {!secondStep.on &&
        (settingUp ? (
          <SecondStepSetup onCancel={() => setSettingUp(false)} />
        ) : (
          <div>
            <Button onClick={() => setSettingUp(true)}>Turn on the second step</Button>
          </div>
        ))}
      {secondStep.on && !secondStep.requiredForRole ? (
        turningOff ? (
          <Formik
            initialValues={{ password: '' }}
            validationSchema={Yup.object({ password: Yup.string().required('Enter your password to turn it off.') })}
            onSubmit={async (values, helpers) => {
              setProblem(undefined);
              try {
                await turnOff.mutateAsync(values.password);
                setTurningOff(false);
              } catch (error) {
                setProblem(applyServerErrors(error, helpers, { fields: ['password'] }));
              }
            }}
          >
            {({ isSubmitting }) => (
              <Form noValidate aria-label="Turn off the second step" className="flex max-w-md flex-col gap-3">
                {problem ? <Notice tone="error">{problem}</Notice> : null}
                <Field name="password" label="Your password" type="password" autoComplete="current-password" />
                <div className="flex flex-wrap gap-2">
                  <Button type="submit" variant="danger" busy={isSubmitting}>
                    Turn off
                  </Button>
                  <Button onClick={() => setTurningOff(false)}>Keep it on</Button>
                </div>
              </Form>
            )}
          </Formik>
        ) : (
          <div>
            <Button onClick={() => setTurningOff(true)}>Turn off the second step</Button>
          </div>
        )
      ) : null}
    </div>
  );
}
