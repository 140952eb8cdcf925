import { Form, Formik, type FormikHelpers } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Field, SelectField } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { assetTypes, assetTypeTitles, type AssetType } from '../../../lib/assets';
import { applyServerErrors } from '../../../lib/form-errors';
import { currencyDigits } from '../../../lib/format';
import { amountText, parseAmount } from '../../../lib/money';
import { useCreateRateCard, type RateCardInput } from '../api/create-rate-card';
import type { RateCardView } from '../../../../shared/billing/views';
import { useUpdateRateCard } from '../api/update-rate-card';
import { SaveOrCancel } from './save-or-cancel';

interface RateValues {
  subject: 'type' | 'kit';
  assetType: string;
  kitId: string;
  day: string;
  week: string;
  month: string;
  lateFee: string;
}

const amounts = [
  ['day', 'dayMinor', 'Day rate'],
  ['week', 'weekMinor', 'Week rate (7 days)'],
  ['month', 'monthMinor', 'Month rate (28 days)'],
  ['lateFee', 'lateFeePerDayMinor', 'Late fee per day'],
] as const;

const fields = ['assetType', 'kitId', ...amounts.map(([field]) => field)];
const aliases = Object.fromEntries(amounts.map(([field, server]) => [server, field]));

/** Rates for an asset type or for a whole kit (a kit with its own card rents as one line). Amounts in the firm's currency. */
export function RateCardForm({
  card,
  kits,
  currency,
  onSaved,
  onCancel,
}: {
  card?: RateCardView;
  kits: { id: string; name: string }[];
  currency: string;
  onSaved: (card: RateCardView) => void;
  onCancel: () => void;
}) {
  const create = useCreateRateCard();
  const update = useUpdateRateCard();
  const [formError, setFormError] = useState<string>();
  const digits = currencyDigits(currency);
  const amount = Yup.string()
    .required('Give an amount; 0 is allowed.')
    .test('amount', `Enter an amount in ${currency}, e.g. ${amountText(18000, digits)}.`, (v) => !v || parseAmount(v, digits) !== null);
  const schema = Yup.object({
    assetType: Yup.string().when('subject', { is: 'type', then: (s) => s.required('Pick the asset type these rates are for.') }),
    kitId: Yup.string().when('subject', { is: 'kit', then: (s) => s.required('Pick the kit these rates are for.') }),
    day: amount,
    week: amount,
    month: amount,
    lateFee: amount,
  });
  const text = (minor: number | undefined) => (minor === undefined ? '' : amountText(minor, digits));
  const initialValues: RateValues = {
    subject: card?.kitId ? 'kit' : 'type',
    assetType: card?.assetType ?? '',
    kitId: card?.kitId ?? '',
    day: text(card?.dayMinor),
    week: text(card?.weekMinor),
    month: text(card?.monthMinor),
    lateFee: text(card?.lateFeePerDayMinor),
  };

  async function submit(values: RateValues, helpers: FormikHelpers<RateValues>) {
    setFormError(undefined);
    const minor = (v: string) => parseAmount(v, digits) ?? 0;
    const input: RateCardInput = {
      assetType: values.subject === 'type' ? (values.assetType as AssetType) : null,
      kitId: values.subject === 'kit' ? values.kitId : null,
      dayMinor: minor(values.day),
      weekMinor: minor(values.week),
      monthMinor: minor(values.month),
      lateFeePerDayMinor: minor(values.lateFee),
    };
    try {
      onSaved(card ? await update.mutateAsync({ id: card.id, ...input }) : await create.mutateAsync(input));
    } catch (error) {
      setFormError(applyServerErrors(error, helpers, { fields, aliases }));
    }
  }

  return (
    <Formik initialValues={initialValues} validationSchema={schema} onSubmit={submit}>
      {({ isSubmitting, values }) => (
        <Form noValidate className="flex flex-col gap-3" aria-label={card ? 'Change rate card' : 'New rate card'}>
          {formError ? <Notice tone="error">{formError}</Notice> : null}
          <div className="grid gap-3 sm:grid-cols-2">
            <SelectField
              name="subject"
              label="Rates for"
              options={[
                { value: 'type', label: 'Every item of one type' },
                { value: 'kit', label: 'A whole kit, as one line' },
              ]}
            />
            {values.subject === 'type' ? (
              <SelectField
                name="assetType"
                label="Asset type"
                options={[{ value: '', label: 'Choose a type' }, ...assetTypes.map((t) => ({ value: t, label: assetTypeTitles[t] }))]}
              />
            ) : (
              <SelectField name="kitId" label="Kit" options={[{ value: '', label: 'Choose a kit' }, ...kits.map((k) => ({ value: k.id, label: k.name }))]} />
            )}
            {amounts.map(([field, , label]) => (
              <Field key={field} name={field} label={`${label} (${currency})`} inputMode="decimal" autoComplete="off" />
            ))}
          </div>
          <p className="text-sm text-ink-700">Each rental is charged the cheapest mix of months, weeks and days that covers its days.</p>
          <SaveOrCancel label={card ? 'Save rates' : 'Add rates'} busy={isSubmitting} onCancel={onCancel} />
        </Form>
      )}
    </Formik>
  );
}
