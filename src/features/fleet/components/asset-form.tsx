import { Form, Formik, useFormikContext } from 'formik';
import { useMemo, useState, type ReactNode } from 'react';
import * as Yup from 'yup';
import { CalibrationChip } from '../../../components/asset-status';
import { Button } from '../../../components/button';
import { DateField } from '../../../components/date-field';
import { CheckboxField, CheckboxGroup, Field, SelectField } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { BatteryCaution, HeavyCaseCaution, LaserCaution } from '../../../components/safety-cautions';
import type { AssetView } from '../../../../shared/assets/views';
import { assetTypes, assetTypeTitles, typesWithFirmware, type AssetType } from '../../../lib/assets';
import { formatWattHours, shippingClass, shippingClassText, wattHours } from '../../../lib/batteries';
import { calibrationState, dueOnForPlan, todayIn } from '../../../lib/calibration';
import { applyServerErrors } from '../../../lib/form-errors';
import { currencyDigits, formatCalendarDate, formatNumber } from '../../../lib/format';
import { useCreateAsset } from '../api/create-asset';
import type { CreateAssetPayload, UpdateAssetPayload } from '../../../../shared/schemas/assets';
import { useUpdateAsset } from '../api/update-asset';
import {
  assetFieldLabels,
  assetFormFields,
  assetFormSchema,
  assetToFormValues,
  emptyAssetFormValues,
  formValuesToPayload,
  specFieldsByType,
  type AssetFormValues,
} from './asset-form-schema';

const typeOptions = [{ value: '', label: 'Choose a type…' }, ...assetTypes.map((t) => ({ value: t, label: assetTypeTitles[t] }))];

const numberProps = { type: 'number', inputMode: 'decimal', step: 'any' } as const;

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="rounded-lg border border-paper-line bg-card p-4">
      <legend className="px-1 text-base font-bold text-ink-900">{title}</legend>
      <div className="grid gap-4 sm:grid-cols-2">{children}</div>
    </fieldset>
  );
}

/** The facts that depend on the type: only the fields that type has. */
function SpecFields({ type }: { type: AssetType }) {
  const { values } = useFormikContext<AssetFormValues>();
  const fields = specFieldsByType[type];
  const v = values.specs;
  const wh =
    typeof v.nominalVoltageV === 'number' && typeof v.ratedCapacityAh === 'number' && v.nominalVoltageV > 0 && v.ratedCapacityAh > 0
      ? wattHours(v.nominalVoltageV, v.ratedCapacityAh)
      : null;

  return (
    <>
      {fields.includes('lengthMm') ? <Field name="specs.lengthMm" label="Tip length (mm)" {...numberProps} /> : null}
      {fields.includes('positions') ? (
        <CheckboxGroup
          name="specs.positions"
          legend="Mounting positions"
          options={[
            { value: 'vertical', label: 'Vertical' },
            { value: 'horizontal', label: 'Horizontal' },
          ]}
        />
      ) : null}
      {fields.includes('nominalVoltageV') ? <Field name="specs.nominalVoltageV" label="Nominal voltage (V)" {...numberProps} /> : null}
      {fields.includes('ratedCapacityAh') ? <Field name="specs.ratedCapacityAh" label="Rated capacity (Ah)" {...numberProps} /> : null}
      {fields.includes('chargeCycles') ? <Field name="specs.chargeCycles" label="Charge cycles" type="number" inputMode="numeric" step={1} min={0} /> : null}
      {fields.includes('damaged') ? <CheckboxField name="specs.damaged" label="Damaged, swollen or dropped" className="self-end" /> : null}
      {type === 'battery' ? (
        <div className="sm:col-span-2 flex flex-col gap-2">
          <p role="status" className="rounded-md bg-paper-deep px-3 py-2 text-ink-900">
            {wh === null ? (
              'Enter the voltage and capacity to see the energy and shipping class.'
            ) : (
              <>
                <strong>{formatWattHours(wh)}</strong> — {shippingClassText[shippingClass(wh, v.damaged)]}
              </>
            )}
          </p>
          <BatteryCaution />
        </div>
      ) : null}
      {fields.includes('diameterMm') ? <Field name="specs.diameterMm" label="Diameter (mm)" {...numberProps} /> : null}
      {fields.includes('certifiedLengthMm') ? <Field name="specs.certifiedLengthMm" label="Certified length (mm)" {...numberProps} /> : null}
      {fields.includes('expansionPpmPerK') ? (
        <Field
          name="specs.expansionPpmPerK"
          label="Expansion coefficient (µm/(m·K))"
          hint="From the bar's certificate; steel is about 11.5, carbon fibre close to 0."
          {...numberProps}
        />
      ) : null}
      {fields.includes('laserClass') ? <Field name="specs.laserClass" label="Laser class" hint="As on the maker's label, e.g. Class 2." /> : null}
      {fields.includes('maxRangeM') ? <Field name="specs.maxRangeM" label="Maximum range (m)" {...numberProps} /> : null}
      {fields.includes('sizeMm') ? <Field name="specs.sizeMm" label="Nest size (mm)" hint="The ball size it seats." {...numberProps} /> : null}
      {fields.includes('massKg') ? <Field name="specs.massKg" label="Mass (kg)" {...numberProps} /> : null}
      {type === 'tracker' ? <LaserCaution laserClass={v.laserClass || null} className="sm:col-span-2" /> : null}
      {type === 'case' ? <HeavyCaseCaution className="sm:col-span-2" /> : null}
      {fields.length === 0 ? <p className="text-ink-700 sm:col-span-2">This type has no extra facts to record.</p> : null}
    </>
  );
}

/** What the calibration plan means today, computed the same way as the server. */
function DuePreview({ timeZone, dueSoonDays }: { timeZone: string; dueSoonDays: number }) {
  const { values } = useFormikContext<AssetFormValues>();
  const cal = values.calibration;
  const interval = typeof cal.intervalMonths === 'number' && Number.isInteger(cal.intervalMonths) && cal.intervalMonths > 0 ? cal.intervalMonths : null;
  const last = /^\d{4}-\d{2}-\d{2}$/.test(cal.lastCalibratedOn) ? cal.lastCalibratedOn : null;
  const dueOn = dueOnForPlan({ required: cal.required, intervalMonths: interval, lastCalibratedOn: last });
  const state = calibrationState(cal.required, dueOn, todayIn(timeZone), dueSoonDays);
  let text: string;
  if (!cal.required) text = 'No calibration is tracked for this item.';
  else if (!interval) text = 'Enter the interval to see the due date.';
  else if (!last) text = 'No calibration on record yet: the item counts as overdue until one is recorded.';
  else text = `Due on ${formatCalendarDate(dueOn)} (valid through that day).`;
  return (
    <div role="status" className="flex flex-wrap items-center gap-2 rounded-md bg-paper-deep px-3 py-2 sm:col-span-2">
      <span className="font-semibold">Due date preview:</span>
      <CalibrationChip state={state} dueOn={dueOn} />
      <span>{text}</span>
    </div>
  );
}

export interface AssetFormProps {
  mode: 'create' | 'edit';
  asset?: AssetView;
  timeZone: string;
  currency: string;
  dueSoonDays: number;
  onSaved: (asset: AssetView) => void;
  onCancel: () => void;
}

/** Register or edit one asset. The type decides which facts are asked for. */
export function AssetForm({ mode, asset, timeZone, currency, dueSoonDays, onSaved, onCancel }: AssetFormProps) {
  const create = useCreateAsset();
  const update = useUpdateAsset();
  const [problem, setProblem] = useState<string>();
  const digits = currencyDigits(currency);
  const initialValues = useMemo(() => (asset ? assetToFormValues(asset, digits) : emptyAssetFormValues()), [asset, digits]);

  return (
    <Formik<AssetFormValues>
      initialValues={initialValues}
      validationSchema={() => Yup.lazy((values: AssetFormValues) => assetFormSchema(values))}
      validateOnMount={false}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        try {
          const payload = formValuesToPayload(values, mode, digits);
          const saved =
            mode === 'create'
              ? await create.mutateAsync(payload as CreateAssetPayload)
              : await update.mutateAsync({ id: asset!.id, changes: payload as UpdateAssetPayload });
          onSaved(saved);
        } catch (error) {
          setProblem(
            applyServerErrors(error, helpers, {
              fields: assetFormFields,
              labels: assetFieldLabels,
              aliases: { replacementValueMinor: 'replacementValue' },
            }),
          );
        }
      }}
    >
      {({ values, isSubmitting, submitCount, isValid }) => {
        const type = values.type || null;
        return (
          <Form noValidate aria-label={mode === 'create' ? 'Register an asset' : 'Edit asset'} className="flex max-w-3xl flex-col gap-5">
            {problem ? (
              <Notice tone="error" title="The asset was not saved">
                {problem}
              </Notice>
            ) : null}

            <Section title="Identity">
              <SelectField
                name="type"
                label="Type"
                options={typeOptions}
                disabled={mode === 'edit'}
                hint={mode === 'edit' ? 'The type of a registered item does not change.' : undefined}
              />
              <Field name="assetTag" label="Asset tag" mono autoComplete="off" hint="Your firm's own label, e.g. TRK-004." />
              <Field name="serialNumber" label="Serial number" mono autoComplete="off" />
              <Field name="manufacturer" label="Manufacturer" autoComplete="off" />
              <Field name="model" label="Model" autoComplete="off" />
              {type && typesWithFirmware.includes(type) ? <Field name="firmwareVersion" label="Firmware version" mono autoComplete="off" /> : null}
              {type === 'tip' ? <Field name="rfidTag" label="RFID tag" mono autoComplete="off" hint="The code the tip's RFID chip reports." /> : null}
              <Field name="location" label="Location" autoComplete="off" hint="Shelf, room or site where it is kept." />
              <Field name="replacementValue" label={`Replacement value (${currency})`} {...numberProps} min={0} step={digits ? 1 / 10 ** digits : 1} />
            </Section>

            {type ? (
              <Section title={`${assetTypeTitles[type]} facts`}>
                <SpecFields type={type} />
              </Section>
            ) : null}

            <Section title="Calibration plan">
              <CheckboxField name="calibration.required" label="Calibration required" className="sm:col-span-2" />
              <Field
                name="calibration.intervalMonths"
                label="Interval (months)"
                type="number"
                inputMode="numeric"
                step={1}
                min={1}
                disabled={!values.calibration.required}
              />
              <Field name="calibration.provider" label="Calibration provider" autoComplete="off" />
              <DateField name="calibration.lastCalibratedOn" label="Last calibrated on" />
              <DuePreview timeZone={timeZone} dueSoonDays={dueSoonDays} />
            </Section>

            <Section title="Notes">
              <Field name="notes" label="Notes" className="sm:col-span-2" autoComplete="off" />
            </Section>

            {submitCount > 0 && !isValid ? <Notice tone="error">Some fields need attention; each says what is wrong.</Notice> : null}
            <div className="flex flex-wrap gap-2">
              <Button type="submit" variant="primary" busy={isSubmitting}>
                Save asset
              </Button>
              <Button onClick={onCancel}>Cancel</Button>
            </div>
          </Form>
        );
      }}
    </Formik>
  );
}
