import { Form, Formik } from 'formik';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { currencyDigits, formatMoney, useFirmFormat } from '../../../lib/format';
import { parseMoneyText } from '../../../lib/money';
import type { OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';
import { ReportUnsaved } from './unsaved-changes';

type Values = { taxPercent: string; depositPercent: string; depositMin: string; depositMax: string };
const fields = ['taxPercent', 'depositPercent', 'depositMin', 'depositMax'] as const;

/** Percentages are typed as text so a decimal comma works too. */
const percent = (v: string | undefined) => (v && /^\d{1,3}([.,]\d{1,2})?$/.test(v.trim()) ? Number(v.trim().replace(',', '.')) : null);

/** Tax on rentals and how deposits are worked out (owner only): the rental form and every quote use these. */
export function RentalTermsForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();
  const { currency } = settings;
  const { locale } = useFirmFormat();
  const digits = currencyDigits(currency);
  // Money settings are shown and typed as money: "€25,000.00".
  const parseAmount = (text: string, places: number) => parseMoneyText(text, places, locale);
  const policy = settings.depositPolicy;
  if (!policy || settings.taxRateBasisPoints === undefined) return <Notice tone="info">This server does not offer rental terms yet.</Notice>;
  const money = Yup.string().test(
    'amount',
    `Enter an amount in ${currency}, e.g. ${formatMoney(50_000, currency)}.`,
    (v) => parseAmount(v ?? '', digits) !== null,
  );
  const schema = Yup.object({
    taxPercent: Yup.string().test('percent', 'Enter a rate from 0 to 100 %, e.g. 19 or 7.5.', (v) => (percent(v) ?? -1) >= 0 && (percent(v) ?? 101) <= 100),
    depositPercent: Yup.string().test('percent', 'Enter a share from 0 to 100 %, e.g. 10.', (v) => (percent(v) ?? -1) >= 0 && (percent(v) ?? 101) <= 100),
    depositMin: money,
    depositMax: money.test('not-below-min', 'The maximum must be at least the minimum.', function (max) {
      const [lo, hi] = [parseAmount(this.parent.depositMin ?? '', digits), parseAmount(max ?? '', digits)];
      return lo === null || hi === null || hi >= lo;
    }),
  });
  return (
    <Formik<Values>
      initialValues={{
        taxPercent: String(settings.taxRateBasisPoints / 100),
        depositPercent: String(policy.percent),
        depositMin: formatMoney(policy.minMinor, currency),
        depositMax: formatMoney(policy.maxMinor, currency),
      }}
      validationSchema={schema}
      enableReinitialize
      onSubmit={(values, helpers) =>
        save(
          {
            taxRateBasisPoints: Math.round(percent(values.taxPercent)! * 100),
            depositPolicy: {
              percent: percent(values.depositPercent)!,
              minMinor: parseAmount(values.depositMin, digits)!,
              maxMinor: parseAmount(values.depositMax, digits)!,
            },
          },
          helpers,
          {
            fields,
            aliases: {
              taxRateBasisPoints: 'taxPercent',
              'depositPolicy.percent': 'depositPercent',
              'depositPolicy.minMinor': 'depositMin',
              'depositPolicy.maxMinor': 'depositMax',
            },
          },
        )
      }
    >
      {({ isSubmitting, dirty }) => (
        <Form noValidate aria-label="Rental terms" className="flex max-w-xl flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
          <ReportUnsaved section="Rental terms" />
          {saved ? (
            <Notice tone="success">Saved. Quotes and new rentals use these terms; rentals already made keep the prices they were made at.</Notice>
          ) : null}
          {problem ? (
            <Notice tone="error" title="Not saved">
              {problem}
            </Notice>
          ) : null}
          <Field name="taxPercent" label="Tax on rentals (%)" inputMode="decimal" autoComplete="off" className="sm:max-w-xs" />
          <div className="grid gap-4 sm:grid-cols-3">
            <Field name="depositPercent" label="Deposit (% of replacement value)" inputMode="decimal" autoComplete="off" />
            <Field name="depositMin" label="Deposit at least" inputMode="decimal" autoComplete="off" />
            <Field name="depositMax" label="Deposit at most" inputMode="decimal" autoComplete="off" />
          </div>
          <p className="text-sm text-ink-700">
            The deposit is authorized on the renter&rsquo;s card at checkout: the share of the rented items&rsquo; replacement value, but never less than the
            minimum or more than the maximum (now {formatMoney(policy.minMinor, currency)} to {formatMoney(policy.maxMinor, currency)}).
          </p>
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting} disabled={!dirty}>
              Save rental terms
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
