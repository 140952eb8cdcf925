import { useId, type ReactNode } from 'react';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSettings } from '../../features/settings/api/get-settings';
import { CheckRulesForm } from '../../features/settings/components/check-rules-form';
import { FirmVoiceForm } from '../../features/settings/components/firm-voice-form';
import { IntervalPolicyForm } from '../../features/settings/components/interval-policy-form';
import { ProvidersForm } from '../../features/settings/components/providers-form';
import { InvoiceIssuerForm } from '../../features/settings/components/invoice-issuer-form';
import { MailForm } from '../../features/settings/components/mail-form';
import { RentalTermsForm } from '../../features/settings/components/rental-terms-form';
import { SettingsForm } from '../../features/settings/components/settings-form';
import { SignInPolicyForm } from '../../features/settings/components/sign-in-policy-form';
import { UnsavedChangesGuard } from '../../features/settings/components/unsaved-changes';

export default function SettingsRoute() {
  const settings = useSettings();
  return (
    <>
      <PageHeader
        title="Settings"
        description="Firm-wide choices: how dates, times and money are written, how due states are worked out, how field checks are judged, which labs calibrate your kit, how calibration intervals are reviewed, the tax and deposit terms of rentals, and how people sign in."
      />
      {settings.isPending ? <LoadingPanel /> : null}
      {settings.isError ? (
        <Notice tone="error" title="The settings could not be loaded">
          {settings.error.message}
        </Notice>
      ) : null}
      {settings.data ? (
        <UnsavedChangesGuard>
          <div className="flex flex-col gap-6">
            <SettingsSection title="Locale and time zone">
              <FirmVoiceForm settings={settings.data} />
            </SettingsSection>
            <SettingsSection title="Due dates and checkout">
              <SettingsForm settings={settings.data} />
            </SettingsSection>
            <SettingsSection title="Field checks">
              <CheckRulesForm settings={settings.data} />
            </SettingsSection>
            <SettingsSection title="Calibration providers">
              <ProvidersForm settings={settings.data} />
            </SettingsSection>
            <SettingsSection title="Interval review">
              <IntervalPolicyForm settings={settings.data} />
            </SettingsSection>
            <SettingsSection title="Rental terms">
              <RentalTermsForm settings={settings.data} />
            </SettingsSection>
            <SettingsSection title="Invoice details">
              <InvoiceIssuerForm settings={settings.data} />
            </SettingsSection>
            <SettingsSection title="Mail">
              <MailForm settings={settings.data} />
            </SettingsSection>
            <SettingsSection title="Signing in">
              <SignInPolicyForm settings={settings.data} />
            </SettingsSection>
          </div>
        </UnsavedChangesGuard>
      ) : null}
    </>
  );
}

/** One titled part of the settings page. */
function SettingsSection({ title, children }: { title: string; children: ReactNode }) {
  const headingId = useId();
  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-2">
      <h2 id={headingId} className="text-lg font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}
