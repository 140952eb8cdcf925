import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSettings } from '../../features/settings/api/get-settings';
import { SettingsForm } from '../../features/settings/components/settings-form';

export default function SettingsRoute() {
  const settings = useSettings();
  return (
    <>
      <PageHeader title="Settings" description="Firm-wide choices that change how dates and due states are worked out." />
      {settings.isPending ? <LoadingPanel /> : null}
      {settings.isError ? (
        <Notice tone="error" title="The settings could not be loaded">
          {settings.error.message}
        </Notice>
      ) : null}
      {settings.data ? <SettingsForm settings={settings.data} /> : null}
    </>
  );
}
