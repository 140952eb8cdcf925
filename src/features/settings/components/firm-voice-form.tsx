import { Form, Formik, useFormikContext } from 'formik';
import { useId, useMemo, useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field, SelectField } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { firmFormat, firmLocales, isFirmLocale, isTimeZoneName, timeZoneNames } from '../../../../shared/formatting/firm-format';
import type { OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';
import { ReportUnsaved } from './unsaved-changes';

type Values = { locale: string; timeZone: string };

const schema = Yup.object({
  locale: Yup.string()
    .required('Choose a locale.')
    .test('locale', 'Choose one of the locales listed.', (v) => !!v && isFirmLocale(v)),
  timeZone: Yup.string()
    .trim()
    .required('Choose a time zone.')
    .test('iana', 'Choose a time zone from the list, such as Europe/Berlin or America/Chicago.', (v) => !!v && isTimeZoneName(v.trim())),
});

const languageNames = new Intl.DisplayNames(['en'], { type: 'language' });
const localeOptions = firmLocales.map((code) => ({ value: code, label: `${languageNames.of(code) ?? code} (${code})` }));

/** The sample a person sees before saving: a date, an amount and a time as every screen, mail and PDF will write them. */
function VoicePreview({ currency, savedZone }: { currency: string; savedZone: string }) {
  const { values } = useFormikContext<Values>();
  const zone = isTimeZoneName(values.timeZone.trim()) ? values.timeZone.trim() : savedZone;
  const sample = firmFormat({ locale: isFirmLocale(values.locale) ? values.locale : 'en-GB', timeZone: zone, currency }, zone);
  return (
    <p className="rounded-md bg-paper-deep px-3 py-2 text-sm text-ink-800" aria-live="polite">
      <span className="font-semibold">Written as: </span>
      <span data-testid="voice-sample">
        {sample.date('2026-12-03')} · {sample.money(125_000)} · {sample.dateRange('2026-12-07', '2026-12-11')}
      </span>
    </p>
  );
}

/** A new voice redraws every screen (the session's format is keyed on it), this form too: its "saved" survives that. */
let savedBeforeRedraw = false;

/** How the firm writes dates, numbers and money, and the zone its days and times are worked out in (owner only). */
export function FirmVoiceForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();
  const [redrawnAfterSave] = useState(() => {
    const was = savedBeforeRedraw;
    savedBeforeRedraw = false;
    return was;
  });
  const zonesId = useId();
  const zones = useMemo(() => timeZoneNames(), []);
  return (
    <Formik<Values>
      initialValues={{ locale: settings.locale, timeZone: settings.timeZone }}
      validationSchema={schema}
      enableReinitialize
      onSubmit={async (values, helpers) => {
        // The redraw may come before or after the save settles; a saved change of voice always brings one.
        savedBeforeRedraw = true;
        const ok = await save({ locale: values.locale, timeZone: values.timeZone.trim() }, helpers, {
          fields: ['locale', 'timeZone'],
          labels: { locale: 'The locale', timeZone: 'The time zone' },
        });
        if (!ok) savedBeforeRedraw = false;
      }}
    >
      {({ isSubmitting, dirty }) => (
        <Form noValidate aria-label="Locale and time zone" className="flex max-w-xl flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
          <ReportUnsaved section="Locale and time zone" />
          {saved || redrawnAfterSave ? <Notice tone="success">Saved. Screens, e-mails and PDFs now write dates, times and money this way.</Notice> : null}
          {problem ? (
            <Notice tone="error" title="Not saved">
              {problem}
            </Notice>
          ) : null}
          <SelectField name="locale" label="Locale" options={localeOptions} hint="How dates, numbers and money are written. Words stay in English." />
          <Field
            name="timeZone"
            label="Time zone"
            list={zonesId}
            autoComplete="off"
            spellCheck={false}
            hint="Type to search the IANA list (e.g. Berlin, Chicago). Dates, due dates, “today” and times are worked out in this zone."
          />
          <datalist id={zonesId}>
            {zones.map((zone) => (
              <option key={zone} value={zone} />
            ))}
          </datalist>
          <VoicePreview currency={settings.currency} savedZone={settings.timeZone} />
          <p className="text-sm text-ink-700">Currency: {settings.currency} (set when the firm was created).</p>
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting} disabled={!dirty}>
              Save locale and time zone
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
