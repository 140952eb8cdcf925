import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSettings } from '../../features/settings/api/get-settings';
import { CheckRulesForm } from '../../features/settings/components/check-rules-form';
import { IntervalPolicyForm } from '../../features/settings/components/interval-policy-form';
import { ProvidersForm } from '../../features/settings/components/providers-form';
import { SettingsForm } from '../../features/settings/components/settings-form';

export default function SettingsRoute() {
  const settings = useSettings();
  return (
    <>
      <PageHeader title="Settings" description="Firm-wide choices: how dates and due states are worked out, how field checks are judged, which labs calibrate your kit and how calibration intervals are reviewed." />
      {settings.isPending ? <LoadingPanel /> : null}
      {settings.isError ? (
        <Notice tone="error" title="The settings could not be loaded">
          {settings.error.message}
        </Notice>
      ) : null}
      {settings.data ? (
        <div className="flex flex-col gap-6">
          <SettingsForm settings={settings.data} />
          <section aria-labelledby="check-settings-heading" className="flex flex-col gap-2">
            <h2 id="check-settings-heading" className="text-lg font-bold">
              Field checks
            </h2>
            <CheckRulesForm settings={settings.data} />
          </section>
          <section aria-labelledby="provider-settings-heading" className="flex flex-col gap-2">
            <h2 id="provider-settings-heading" className="text-lg font-bold">
              Calibration providers
            </h2>
            <ProvidersForm settings={settings.data} />
          </section>
          <section aria-labelledby="interval-settings-heading" className="flex flex-col gap-2">
            <h2 id="interval-settings-heading" className="text-lg font-bold">
              Interval review
            </h2>
            <IntervalPolicyForm settings={settings.data} />
          </section>
        </div>
      ) : null}
    </>
  );
}
