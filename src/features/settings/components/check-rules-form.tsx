import { Form, Formik, useField } from 'formik';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { checkKindWords, type CheckKind, type DecisionRule, type Tolerance } from '../../../lib/checks';
import type { OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';
import { ReportUnsaved } from './unsaved-changes';

const kinds = Object.keys(checkKindWords) as CheckKind[];

type ToleranceValues = { kind: 'fixed' | 'range'; um: string; aUm: string; bUmPerM: string };
type Values = { decisionRule: DecisionRule; triageRatio: string; tolerances: Record<CheckKind, ToleranceValues> };

const num = (v: string) => Number(v.trim().replace(',', '.'));
const isNum = (v: string | undefined) => !!v && v.trim() !== '' && Number.isFinite(num(v));

const toleranceSchema = Yup.object({
  kind: Yup.string().oneOf(['fixed', 'range']),
  um: Yup.string().when('kind', {
    is: 'fixed',
    then: (s) => s.test('um', 'Enter a tolerance in µm, more than 0.', (v) => isNum(v) && num(v!) > 0 && num(v!) <= 100_000),
  }),
  aUm: Yup.string().when('kind', {
    is: 'range',
    then: (s) => s.test('a', 'Enter A in µm, 0 or more.', (v) => isNum(v) && num(v!) >= 0 && num(v!) <= 100_000),
  }),
  bUmPerM: Yup.string().when('kind', {
    is: 'range',
    then: (s) => s.test('b', 'Enter B in µm per metre, 0 or more.', (v) => isNum(v) && num(v!) >= 0 && num(v!) <= 10_000),
  }),
});

const schema = Yup.object({
  decisionRule: Yup.string().oneOf(['simple', 'guarded']),
  triageRatio: Yup.string().test('ratio', 'Enter a ratio from 1 to 20, e.g. 4 for 4:1.', (v) => isNum(v) && num(v!) >= 1 && num(v!) <= 20),
  tolerances: Yup.object(Object.fromEntries(kinds.map((k) => [k, toleranceSchema]))),
});

function toValues(t: Tolerance | undefined): ToleranceValues {
  if (!t) return { kind: 'fixed', um: '', aUm: '', bUmPerM: '' };
  return t.kind === 'fixed'
    ? { kind: 'fixed', um: String(t.um), aUm: '', bUmPerM: '' }
    : { kind: 'range', um: '', aUm: String(t.aUm), bUmPerM: String(t.bUmPerM) };
}

const fromValues = (v: ToleranceValues): Tolerance =>
  v.kind === 'fixed' ? { kind: 'fixed', um: num(v.um) } : { kind: 'range', aUm: num(v.aUm), bUmPerM: num(v.bUmPerM) };

function Radio({ name, value, label, hint }: { name: string; value: string; label: string; hint?: string }) {
  const [field] = useField({ name, type: 'radio', value });
  return (
    <label className="flex cursor-pointer items-start gap-2 py-1">
      <input type="radio" {...field} className="mt-1 size-5 shrink-0 accent-brass-deep" />
      <span>
        <span className="font-semibold">{label}</span>
        {hint ? <span className="block text-sm text-ink-700">{hint}</span> : null}
      </span>
    </label>
  );
}

function ToleranceFields({ kind }: { kind: CheckKind }) {
  const [mode] = useField<string>(`tolerances.${kind}.kind`);
  return (
    <fieldset className="flex flex-col gap-2 rounded-md border border-paper-line p-3">
      <legend className="px-1 font-semibold">{checkKindWords[kind]}</legend>
      <div className="flex flex-wrap gap-x-6">
        <Radio name={`tolerances.${kind}.kind`} value="fixed" label="Fixed" />
        <Radio name={`tolerances.${kind}.kind`} value="range" label="Grows with distance (A + B·L)" />
      </div>
      {mode.value === 'fixed' ? (
        <Field name={`tolerances.${kind}.um`} label={`${checkKindWords[kind]} tolerance (µm)`} inputMode="decimal" className="sm:max-w-56" />
      ) : (
        <div className="grid gap-2 sm:grid-cols-2">
          <Field name={`tolerances.${kind}.aUm`} label={`${checkKindWords[kind]}: A (µm)`} inputMode="decimal" />
          <Field
            name={`tolerances.${kind}.bUmPerM`}
            label={`${checkKindWords[kind]}: B (µm/m)`}
            inputMode="decimal"
            hint="L is the distance from the tracker in metres."
          />
        </div>
      )}
    </fieldset>
  );
}

/** How field checks are judged: the decision rule and the firm's tolerance per check kind (owner only). */
export function CheckRulesForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();
  if (!settings.decisionRule || !settings.tolerances) {
    return <Notice tone="info">This server does not offer field-check settings yet.</Notice>;
  }
  const tolerances = settings.tolerances;
  return (
    <Formik<Values>
      initialValues={{
        decisionRule: settings.decisionRule,
        triageRatio: String(settings.triageRatio),
        tolerances: Object.fromEntries(kinds.map((k) => [k, toValues(tolerances[k])])) as Record<CheckKind, ToleranceValues>,
      }}
      validationSchema={schema}
      enableReinitialize
      onSubmit={(values, helpers) =>
        save(
          {
            decisionRule: values.decisionRule,
            triageRatio: num(values.triageRatio),
            tolerances: Object.fromEntries(kinds.map((k) => [k, fromValues(values.tolerances[k])])),
          },
          helpers,
          {
            fields: ['decisionRule', 'triageRatio', ...kinds.flatMap((k) => ['um', 'aUm', 'bUmPerM'].map((f) => `tolerances.${k}.${f}`))],
          },
        )
      }
    >
      {({ isSubmitting, dirty }) => (
        <Form noValidate aria-label="Field checks" className="flex max-w-xl flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
          <ReportUnsaved section="Field checks" />
          {saved ? <Notice tone="success">Saved. New field checks are judged this way.</Notice> : null}
          {problem ? (
            <Notice tone="error" title="Not saved">
              {problem}
            </Notice>
          ) : null}
          <fieldset>
            <legend className="mb-1 font-semibold">Decision rule</legend>
            <Radio name="decisionRule" value="simple" label="Simple acceptance" hint="A check passes when its result is within the tolerance." />
            <Radio
              name="decisionRule"
              value="guarded"
              label="Guarded acceptance"
              hint="A check passes only when its result is within the tolerance less its expanded uncertainty U (the guard band), as ILAC-G8 describes; fewer wrong passes, more wrong fails."
            />
          </fieldset>
          <Field
            name="triageRatio"
            label="Impact triage ratio (n:1)"
            inputMode="decimal"
            className="sm:max-w-56"
            hint="In an impact review, an instrument error within a job's tightest tolerance ÷ this ratio suggests “no effect likely”; more suggests a re-measure. 4:1 is common practice. It advises; the owner decides each booking."
          />
          <p className="text-sm text-ink-700">
            Tolerances for each kind of check. Use the instrument maker&rsquo;s figures; an item can carry its own values. Lengths in µm; B in µm per metre of
            distance from the tracker.
          </p>
          {kinds.map((k) => (
            <ToleranceFields key={k} kind={k} />
          ))}
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting} disabled={!dirty}>
              Save check settings
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
