import { Form, Formik } from 'formik';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { formatNumber } from '../../../lib/format';
import type { IntervalPolicy } from '../../../../shared/calibration/interval-review';
import type { OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';
import { ReportUnsaved } from './unsaved-changes';

type Values = { lengthenAfter: number | ''; lengthenFactor: string; shortenFactor: string; minMonths: number | ''; maxMonths: number | '' };

const fields = ['lengthenAfter', 'lengthenFactor', 'shortenFactor', 'minMonths', 'maxMonths'] as const;

/** Factors are typed as text so a decimal comma works too. */
const num = (v: string) => Number(v.trim().replace(',', '.'));
const isNum = (v: string | undefined) => !!v && v.trim() !== '' && Number.isFinite(num(v));

const wholeNumber = (min: number, max: number, message: string) =>
  Yup.number().typeError(message).required(message).integer(message).min(min, message).max(max, message);

const monthsMessage = 'Enter whole months from 1 to 120.';

const schema = Yup.object({
  lengthenAfter: wholeNumber(1, 10, 'Enter a whole number from 1 to 10.'),
  lengthenFactor: Yup.string().test('factor', 'Enter a factor from 1 to 3, such as 1.25.', (v) => isNum(v) && num(v!) >= 1 && num(v!) <= 3),
  shortenFactor: Yup.string().test('factor', 'Enter a factor above 0 and at most 1, such as 0.5.', (v) => isNum(v) && num(v!) > 0 && num(v!) <= 1),
  minMonths: wholeNumber(1, 120, monthsMessage),
  maxMonths: wholeNumber(1, 120, monthsMessage).test('not-below-min', 'The longest interval must be at least the shortest.', function (max) {
    const min = this.parent.minMonths as unknown;
    return typeof min !== 'number' || typeof max !== 'number' || max >= min;
  }),
});

const toValues = (p: IntervalPolicy): Values => ({
  lengthenAfter: p.lengthenAfter,
  lengthenFactor: String(p.lengthenFactor),
  shortenFactor: String(p.shortenFactor),
  minMonths: p.minMonths,
  maxMonths: p.maxMonths,
});

const fromValues = (v: Values): IntervalPolicy => ({
  lengthenAfter: Number(v.lengthenAfter),
  lengthenFactor: num(v.lengthenFactor),
  shortenFactor: num(v.shortenFactor),
  minMonths: Number(v.minMonths),
  maxMonths: Number(v.maxMonths),
});

/** The one-line explanation, with the typed figures while they are valid and the saved ones otherwise. */
function Explanation({ values, saved }: { values: Values; saved: IntervalPolicy }) {
  const typed = fromValues(values);
  const n = Number.isInteger(typed.lengthenAfter) && typed.lengthenAfter >= 1 && typed.lengthenAfter <= 10 ? typed.lengthenAfter : saved.lengthenAfter;
  const f = typed.lengthenFactor >= 1 && typed.lengthenFactor <= 3 ? typed.lengthenFactor : saved.lengthenFactor;
  const s = typed.shortenFactor > 0 && typed.shortenFactor <= 1 ? typed.shortenFactor : saved.shortenFactor;
  return (
    <p className="text-sm text-ink-700" aria-live="polite">
      After {n} in-tolerance result{n === 1 ? '' : 's'} in a row the suggested interval grows by ×{formatNumber(f, 3)}; after an out-of-tolerance result it
      shrinks by ×{formatNumber(s, 3)}, within the range below; a suggestion never moves against the result, so an interval outside the range is left to a
      person. The owner accepts or declines each suggestion.
    </p>
  );
}

/** The staircase interval review of OIML D 10 / ILAC-G24: when to suggest a longer or shorter calibration interval (owner only). */
export function IntervalPolicyForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();
  const policy = settings.intervalPolicy;
  if (!policy) {
    return <Notice tone="info">This server does not offer interval review settings yet.</Notice>;
  }
  return (
    <Formik<Values>
      initialValues={toValues(policy)}
      validationSchema={schema}
      enableReinitialize
      onSubmit={(values, helpers) =>
        save({ intervalPolicy: fromValues(values) }, helpers, {
          fields,
          aliases: Object.fromEntries(fields.map((f) => [`intervalPolicy.${f}`, f])),
          // No labels: the server words these as whole clauses ("the shortest interval must not exceed the longest").
        })
      }
    >
      {({ isSubmitting, dirty, values }) => (
        <Form noValidate aria-label="Interval review" className="flex max-w-xl flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
          <ReportUnsaved section="Interval review" />
          {saved ? <Notice tone="success">Saved. Calibrations recorded from now on are reviewed with these rules.</Notice> : null}
          {problem ? (
            <Notice tone="error" title="Not saved">
              {problem}
            </Notice>
          ) : null}
          <Explanation values={values} saved={policy} />
          <Field
            name="lengthenAfter"
            label="In-tolerance results in a row before lengthening"
            type="number"
            inputMode="numeric"
            min={1}
            max={10}
            step={1}
            className="sm:max-w-sm"
          />
          <div className="grid gap-4 sm:grid-cols-2">
            <Field name="lengthenFactor" label="Lengthen by (factor)" inputMode="decimal" autoComplete="off" hint="From 1 to 3." />
            <Field name="shortenFactor" label="Shorten by (factor)" inputMode="decimal" autoComplete="off" hint="Above 0, at most 1." />
            <Field name="minMonths" label="Shortest interval (months)" type="number" inputMode="numeric" min={1} max={120} step={1} />
            <Field name="maxMonths" label="Longest interval (months)" type="number" inputMode="numeric" min={1} max={120} step={1} />
          </div>
          <p className="text-sm text-ink-700">
            This is the staircase method of OIML D 10 / ILAC-G24. Suggestions never go below the shortest interval or above the longest.
          </p>
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting} disabled={!dirty}>
              Save interval rules
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
