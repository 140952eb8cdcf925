import { Form, Formik, useFormikContext } from 'formik';
import { useEffect, useId, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import * as Yup from 'yup';
import { Button, buttonClasses } from '../../../components/button';
import { Field, SelectField } from '../../../components/field';
import { PlusIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import { LaserCaution } from '../../../components/safety-cautions';
import type { AssetView } from '../../../../shared/assets/views';
import { assetTypeTitles, type TipPosition } from '../../../lib/assets';
import {
  DEFAULT_TIP_READINGS,
  expectedLengthMm,
  MIN_TIP_READINGS,
  REFERENCE_TEMPERATURE_C,
  type CheckKind,
  type DecisionRule,
  type Tolerance,
} from '../../../lib/checks';
import { applyServerErrors } from '../../../lib/form-errors';
import { formatNumber } from '../../../lib/format';
import { useCreateCheck } from '../api/create-check';
import { useTipValidation } from '../api/get-tip-validation';
import type { CheckView } from '../../../../shared/checks/views';
import { CheckPreview } from './check-preview';
import { CheckResult } from './check-result';
import {
  checkFormFields,
  checkPayloadFrom,
  checkSchema,
  emptyPoint,
  MAX_TIP_READINGS,
  previewCheck,
  type CheckFormValues,
  type CheckRules,
  type ScaleBarFacts,
} from './check-values';
import { checkKindsFor, checkKindWords, positionWords, tipStateWords, toleranceText } from './check-words';
import { NumberCell } from './number-cell';
import { parseDecimal, parseReadings, pointText, toPoint } from './parse-readings';
import { PointFields } from './point-fields';
import { ReadingsSketch } from './readings-sketch';

/** The firm's settings as far as checks need them (GET /api/settings). */
export interface FirmCheckSettings {
  decisionRule?: DecisionRule;
  tolerances?: Partial<Record<CheckKind, Tolerance>>;
}

function scaleBarFacts(bar: AssetView): ScaleBarFacts | null {
  const length = Number(bar.specs.certifiedLengthMm);
  const alpha = Number(bar.specs.expansionPpmPerK);
  if (!Number.isFinite(length) || !Number.isFinite(alpha)) return null;
  return { id: bar.id, assetTag: bar.assetTag, certifiedLengthMm: length, expansionPpmPerK: alpha };
}

/** The asset's own tolerance for a kind wins over the firm's. */
function rulesFor(asset: AssetView, settings: FirmCheckSettings): CheckRules {
  const overrides = (asset.toleranceOverrides ?? {}) as Partial<Record<CheckKind, Tolerance>>;
  return {
    decisionRule: settings.decisionRule ?? null,
    tolerances: { ...settings.tolerances, ...Object.fromEntries(Object.entries(overrides).filter(([, v]) => v)) },
  };
}

/** A check the server refused, opened again as it was written (same id: the server stored nothing under it). */
export type CheckCorrection = { id: string; values: CheckFormValues; performedAt: string };

export function RecordCheckForm({
  asset,
  settings,
  probes,
  scaleBars,
  initialKind,
  userId,
  correcting,
}: {
  asset: AssetView;
  settings: FirmCheckSettings;
  probes: AssetView[];
  scaleBars: AssetView[];
  initialKind?: string | null;
  /** Who records it: the outbox sends a person's records only while they are signed in. */
  userId: string;
  correcting?: CheckCorrection;
}) {
  const kinds = checkKindsFor(asset.type);
  const positions = useMemo(() => (asset.specs.positions as TipPosition[] | undefined) ?? [], [asset.specs.positions]);
  const rules = useMemo(() => rulesFor(asset, settings), [asset, settings]);
  const bars = useMemo(() => scaleBars.map(scaleBarFacts).filter((b): b is ScaleBarFacts => b !== null), [scaleBars]);
  const create = useCreateCheck();
  const [problem, setProblem] = useState<string>();
  const [saved, setSaved] = useState<CheckView | null>(null);
  const [waiting, setWaiting] = useState<CheckFormValues | null>(null);
  const [round, setRound] = useState(0);
  // The check's id is made when the form opens: a second press of Save, or the outbox sending again, cannot make two.
  const [recordId, setRecordId] = useState(() => correcting?.id ?? crypto.randomUUID());
  const nextRound = () => {
    setSaved(null);
    setWaiting(null);
    setRecordId(crypto.randomUUID());
    setRound((r) => r + 1);
  };

  if (!kinds.length) {
    return (
      <Notice tone="info" title={`No field checks for a ${assetTypeTitles[asset.type].toLowerCase()}`}>
        Field checks are recorded for probe tips (tip validation) and laser trackers (two-face and length checks). For this item, record a calibration instead.
      </Notice>
    );
  }

  if (saved) {
    return (
      <section aria-labelledby="saved-heading" className="flex flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
        <h2 id="saved-heading" className="text-lg font-bold">
          Check saved
        </h2>
        <CheckResult check={saved} assetTag={asset.assetTag} />
        <div className="flex flex-wrap gap-2">
          <Link to={`/fleet/${asset.id}`} className={buttonClasses('primary', 'md', 'min-h-11')}>
            Back to {asset.assetTag}
          </Link>
          <Button className="min-h-11" onClick={nextRound}>
            Record another check
          </Button>
        </div>
      </section>
    );
  }

  if (waiting) {
    const preview = previewCheck(
      waiting,
      rules,
      bars.find((b) => b.id === waiting.scaleBarId),
    );
    return (
      <section aria-labelledby="queued-heading" className="flex flex-col gap-4 rounded-lg border-2 border-ink-900 bg-card p-4">
        <h2 id="queued-heading" className="text-lg font-bold">
          Saved on this phone — waiting for signal
        </h2>
        <p>
          The check is kept on this phone and sent by itself when there is signal. The preview below is worked out here the same way the server works it out;
          the server&rsquo;s decision is final and shows under “Records on this phone” once it arrives.
        </p>
        {preview.decision === 'fail' ? (
          <Notice tone="error" title={`Do not use ${asset.assetTag}`}>
            The preview says it fails. It is put on hold, and the shop manager and the owner are e-mailed, as soon as the check reaches the server.
          </Notice>
        ) : null}
        <CheckPreview preview={preview} rule={rules.decisionRule} />
        <div className="flex flex-wrap gap-2">
          <Link to={`/fleet/${asset.id}`} className={buttonClasses('primary', 'md', 'min-h-11')}>
            Back to {asset.assetTag}
          </Link>
          <Button className="min-h-11" onClick={nextRound}>
            Record another check
          </Button>
        </div>
      </section>
    );
  }

  const firstKind = kinds.includes(initialKind as CheckKind) ? (initialKind as CheckKind) : kinds[0];
  const initialValues: CheckFormValues = correcting?.values ?? {
    kind: firstKind,
    position: positions.length === 1 ? positions[0] : '',
    probeId: '',
    reference: emptyPoint(),
    readings: Array.from({ length: DEFAULT_TIP_READINGS }, emptyPoint),
    paste: '',
    front: emptyPoint(),
    back: emptyPoint(),
    scaleBarId: bars.length === 1 ? bars[0].id : '',
    endA: emptyPoint(),
    endB: emptyPoint(),
    temperatureC: '',
    distanceM: '',
    uncertaintyComponents: '',
    uncertaintyU: '',
    note: '',
  };

  return (
    <Formik<CheckFormValues>
      key={round}
      initialValues={initialValues}
      validationSchema={Yup.lazy((values: CheckFormValues) => checkSchema(values, rules, positions))}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        try {
          const title = [
            checkKindWords[values.kind],
            asset.assetTag,
            values.kind === 'tip_validation' && values.position ? positionWords[values.position as TipPosition] : null,
          ]
            .filter(Boolean)
            .join(' · ');
          const outcome = await create.mutateAsync({
            // The time the work was done, kept apart from the time it reaches the server.
            payload: { ...checkPayloadFrom(values, asset.id), id: recordId, performedAt: correcting?.performedAt ?? new Date().toISOString() },
            userId,
            title,
            draft: values,
          });
          if (outcome.state === 'sent') setSaved(outcome.check);
          else setWaiting(values);
          window.scrollTo({ top: 0 });
        } catch (error) {
          setProblem(
            applyServerErrors(error, helpers, {
              fields: checkFormFields,
              aliases: { uncertaintyUm: 'uncertaintyU', uncertaintyComponentsUm: 'uncertaintyComponents' },
              labels: {
                distanceM: 'The distance',
                position: 'The position',
                probeId: 'The probe',
                scaleBarId: 'The scale bar',
                temperatureC: 'The temperature',
              },
            }),
          );
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate aria-label="Record a check" className="grid items-start gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(18rem,2fr)]">
          <div className="flex min-w-0 flex-col gap-5 rounded-lg border border-paper-line bg-card p-4 lg:col-start-1 lg:row-start-1">
            {problem ? (
              <Notice tone="error" title="Not saved">
                {problem}
              </Notice>
            ) : null}
            <KindChoice kinds={kinds} />
            <CheckInputs asset={asset} positions={positions} probes={probes} bars={bars} />
            <OptionalInputs rules={rules} />
          </div>
          {/* On a phone the preview comes before the save button, so the decision is seen first. */}
          <div className="lg:sticky lg:top-4 lg:col-start-2 lg:row-span-2 lg:row-start-1">
            <LivePreview rules={rules} bars={bars} />
          </div>
          <div className="flex flex-wrap gap-2 lg:col-start-1 lg:row-start-2">
            <Button type="submit" variant="primary" busy={isSubmitting} className="min-h-12 px-6 text-lg">
              Save check
            </Button>
            <Link to={`/fleet/${asset.id}`} className={buttonClasses('secondary', 'md', 'min-h-12')}>
              Cancel
            </Link>
          </div>
        </Form>
      )}
    </Formik>
  );
}

function KindChoice({ kinds }: { kinds: CheckKind[] }) {
  const { values, setFieldValue } = useFormikContext<CheckFormValues>();
  if (kinds.length === 1) return <p className="text-lg font-semibold">{checkKindWords[kinds[0]]}</p>;
  return (
    <fieldset>
      <legend className="mb-1 font-semibold text-ink-900">Kind of check</legend>
      <div className="flex flex-wrap gap-2">
        {kinds.map((k) => (
          <label
            key={k}
            className={`flex min-h-11 cursor-pointer items-center gap-2 rounded-md border px-3 ${
              values.kind === k ? 'border-brass-deep bg-brass-wash font-semibold' : 'border-paper-line bg-card'
            }`}
          >
            <input
              type="radio"
              name="kind"
              value={k}
              checked={values.kind === k}
              onChange={() => void setFieldValue('kind', k)}
              className="size-5 accent-brass-deep"
            />
            {checkKindWords[k]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

function CheckInputs({ asset, positions, probes, bars }: { asset: AssetView; positions: TipPosition[]; probes: AssetView[]; bars: ScaleBarFacts[] }) {
  const { values } = useFormikContext<CheckFormValues>();
  const tipStatus = useTipValidation(asset.id, { enabled: asset.type === 'tip' });
  if (values.kind === 'tip_validation') {
    const stateOf = (p: TipPosition) => tipStatus.data?.positions.find((s) => s.position === p)?.state;
    return (
      <>
        <div className="grid gap-3 sm:grid-cols-2">
          <SelectField
            name="position"
            label="Position"
            hint="The mounting position the tip was validated in."
            options={[
              ...(positions.length === 1 ? [] : [{ value: '', label: 'Choose…' }]),
              ...positions.map((p) => {
                const state = stateOf(p);
                return { value: p, label: `${positionWords[p]}${state ? ` — now ${tipStateWords[state].toLowerCase()}` : ''}` };
              }),
            ]}
          />
          <SelectField
            name="probeId"
            label="Probe"
            hint="Optional: the probe the tip was on."
            options={[{ value: '', label: 'Not recorded' }, ...probes.map((p) => ({ value: p.id, label: [p.assetTag, p.model].filter(Boolean).join(' · ') }))]}
          />
        </div>
        <PointFields name="reference" prefix="Reference" legend="Reference point R" hint="The SMR's reading in the nest, in mm, from the tracker." />
        <ReadingsTable />
        <PasteReadings />
      </>
    );
  }
  if (values.kind === 'two_face') {
    return (
      <>
        <LaserCaution laserClass={typeof asset.specs.laserClass === 'string' ? `Class ${asset.specs.laserClass}` : null} />
        <PointFields name="front" prefix="Front face" legend="Front-face reading" hint="The target read in front face, in mm." />
        <PointFields name="back" prefix="Back face" legend="Back-face reading" hint="The same target read in back face, in mm." />
      </>
    );
  }
  const bar = bars.find((b) => b.id === values.scaleBarId);
  const t = parseDecimal(values.temperatureC);
  return (
    <>
      <LaserCaution laserClass={typeof asset.specs.laserClass === 'string' ? `Class ${asset.specs.laserClass}` : null} />
      <SelectField
        name="scaleBarId"
        label="Scale bar"
        options={[
          { value: '', label: bars.length ? 'Choose…' : 'No scale bars in the fleet' },
          ...bars.map((b) => ({ value: b.id, label: `${b.assetTag} · ${formatNumber(b.certifiedLengthMm, 4)} mm at 20 °C` })),
        ]}
      />
      <PointFields name="endA" prefix="End A" legend="End A nest reading" />
      <PointFields name="endB" prefix="End B" legend="End B nest reading" />
      <Field
        name="temperatureC"
        label="Bar temperature (°C)"
        inputMode="decimal"
        autoComplete="off"
        className="sm:max-w-56"
        hint={
          bar
            ? `Certified length ${formatNumber(bar.certifiedLengthMm, 4)} mm at the ISO 1 reference temperature of ${REFERENCE_TEMPERATURE_C} °C; α = ${formatNumber(bar.expansionPpmPerK, 2)} µm/(m·K).${
                t !== null
                  ? ` Expected at ${formatNumber(t, 1)} °C: ${formatNumber(expectedLengthMm(bar.certifiedLengthMm, bar.expansionPpmPerK, t), 4)} mm.`
                  : ''
              }`
            : `Lengths are certified at the ISO 1 reference temperature of ${REFERENCE_TEMPERATURE_C} °C; the expected length is corrected to this temperature.`
        }
      />
    </>
  );
}

function ReadingsTable() {
  const { values, setFieldValue, errors } = useFormikContext<CheckFormValues>();
  const rows = values.readings;
  const tableError = typeof errors.readings === 'string' ? errors.readings : undefined;
  return (
    <fieldset className="min-w-0">
      <legend className="mb-1 font-semibold text-ink-900">Readings with the probe tip</legend>
      <p className="mb-2 text-sm text-ink-500">The tip seated in the reference sphere, read in different orientations (at least {MIN_TIP_READINGS}, mm).</p>
      <table className="w-full table-fixed border-separate border-spacing-x-0.5 border-spacing-y-1 sm:border-spacing-x-1">
        <thead>
          <tr className="text-left text-sm text-ink-700">
            <th scope="col" className="w-5 font-semibold sm:w-8">
              #
            </th>
            <th scope="col" className="font-semibold">
              X (mm)
            </th>
            <th scope="col" className="font-semibold">
              Y (mm)
            </th>
            <th scope="col" className="font-semibold">
              Z (mm)
            </th>
            <th scope="col" className="w-8 sm:w-10">
              <span className="sr-only">Remove</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((_, i) => (
            <tr key={i} className="align-top">
              <th scope="row" className="pt-2 text-sm font-semibold text-ink-700">
                {i + 1}
              </th>
              {(['x', 'y', 'z'] as const).map((axis) => (
                <td key={axis}>
                  <NumberCell name={`readings.${i}.${axis}`} label={`Reading ${i + 1} ${axis.toUpperCase()} (mm)`} />
                </td>
              ))}
              <td>
                <button
                  type="button"
                  aria-label={`Remove reading ${i + 1}`}
                  disabled={rows.length <= MIN_TIP_READINGS}
                  onClick={() =>
                    void setFieldValue(
                      'readings',
                      rows.filter((__, j) => j !== i),
                    )
                  }
                  className="flex min-h-10 w-full items-center justify-center rounded-md text-lg text-ink-700 hover:bg-paper-deep disabled:opacity-35"
                >
                  ×
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {tableError ? <p className="text-sm text-bad">{tableError}</p> : null}
      <Button
        size="sm"
        className="mt-1"
        icon={<PlusIcon size={14} />}
        disabled={rows.length >= MAX_TIP_READINGS}
        onClick={() => void setFieldValue('readings', [...rows, emptyPoint()])}
      >
        Add a reading
      </Button>
    </fieldset>
  );
}

function PasteReadings() {
  const { values, setFieldValue } = useFormikContext<CheckFormValues>();
  const id = useId();
  const parsed = useMemo(() => parseReadings(values.paste), [values.paste]);
  const [filled, setFilled] = useState<number | null>(null);
  useEffect(() => {
    if (!values.paste.trim() || parsed.problems.length || !parsed.points.length) {
      setFilled(null);
      return;
    }
    const points = parsed.points.slice(0, MAX_TIP_READINGS).map(pointText);
    while (points.length < MIN_TIP_READINGS) points.push(emptyPoint());
    void setFieldValue('readings', points);
    setFilled(Math.min(parsed.points.length, MAX_TIP_READINGS));
    // Fill only when the pasted text changes, not on every edit of the table.
  }, [values.paste]);
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink-800">
        Paste readings
      </label>
      <textarea
        id={id}
        name="paste"
        rows={3}
        value={values.paste}
        onChange={(e) => void setFieldValue('paste', e.target.value)}
        aria-describedby={`${id}-hint`}
        spellCheck={false}
        className="w-full rounded-md border border-paper-line bg-card px-3 py-1.5 font-mono text-[0.95rem]"
      />
      <p id={`${id}-hint`} className="text-sm text-ink-500">
        Rows copied from a spreadsheet fill the table: one reading per line, X Y Z separated by tabs, semicolons, commas or spaces; a decimal comma is fine.
      </p>
      {filled !== null ? <p className="text-sm text-ok">Filled the table with {filled} readings.</p> : null}
      {parsed.problems.length ? (
        <ul className="list-disc pl-5 text-sm text-bad" role="alert">
          {parsed.problems.slice(0, 5).map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

function OptionalInputs({ rules }: { rules: CheckRules }) {
  const { values } = useFormikContext<CheckFormValues>();
  const tolerance = rules.tolerances[values.kind];
  return (
    <details className="rounded-md border border-paper-line px-3 py-2" open={tolerance?.kind === 'range' || undefined}>
      <summary className="cursor-pointer font-semibold">Distance, uncertainty and a note</summary>
      <div className="mt-3 flex flex-col gap-3">
        <Field
          name="distanceM"
          label="Distance from tracker (m)"
          inputMode="decimal"
          autoComplete="off"
          className="sm:max-w-64"
          hint={
            tolerance
              ? tolerance.kind === 'range'
                ? `Needed: the tolerance is ${toleranceText(tolerance)}.`
                : `Optional: the tolerance is a fixed ${toleranceText(tolerance)}.`
              : 'Needed when the tolerance depends on the distance.'
          }
        />
        <div className="grid gap-3 sm:grid-cols-2">
          <Field
            name="uncertaintyComponents"
            label="Uncertainty components (µm)"
            autoComplete="off"
            hint="Standard uncertainties, comma-separated; combined by root sum of squares, then U = 2·u (JCGM 100)."
          />
          <Field name="uncertaintyU" label="Expanded uncertainty U (µm)" inputMode="decimal" autoComplete="off" hint="Or U itself, k = 2. Not both." />
        </div>
        <NoteField />
      </div>
    </details>
  );
}

function NoteField() {
  const { values, setFieldValue } = useFormikContext<CheckFormValues>();
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink-800">
        Note
      </label>
      <textarea
        id={id}
        rows={2}
        value={values.note}
        onChange={(e) => void setFieldValue('note', e.target.value)}
        className="w-full rounded-md border border-paper-line bg-card px-3 py-1.5"
      />
    </div>
  );
}

function LivePreview({ rules, bars }: { rules: CheckRules; bars: ScaleBarFacts[] }) {
  const { values } = useFormikContext<CheckFormValues>();
  const bar = bars.find((b) => b.id === values.scaleBarId);
  const preview = previewCheck(values, rules, bar);
  const reference = values.kind === 'tip_validation' ? toPoint(values.reference) : null;
  return (
    <div className="flex flex-col gap-3">
      <CheckPreview preview={preview} rule={rules.decisionRule} />
      {reference ? <ReadingsSketch reference={reference} readings={values.readings.map(toPoint)} toleranceUm={preview.toleranceUm} /> : null}
    </div>
  );
}
