import { Form, Formik, useFormikContext } from 'formik';
import * as Yup from 'yup';
import type { AuditPackScope } from '../../../../shared/schemas/records';
import { Button } from '../../../components/button';
import { DateField } from '../../../components/date-field';
import { SelectField } from '../../../components/field';
import { DownloadIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import { UploadProgress } from '../../../components/upload-progress';
import { assetTypes, assetTypeTitles } from '../../../lib/assets';
import { formatCount, formatFileSize } from '../../../lib/format';
import { useAuditPackDownload } from '../api/download-audit-pack';
import { useAuditPackPreview } from '../api/get-audit-pack-preview';
import type { AuditPackChoice } from '../api/keys';

type Values = { from: string; to: string; scope: AuditPackScope; kitId: string; type: string };

const scopeOptions: { value: AuditPackScope; label: string }[] = [
  { value: 'all', label: 'Every item' },
  { value: 'kit', label: 'The items of one kit' },
  { value: 'type', label: 'Every item of one type' },
  { value: 'flagged', label: 'Items found out of tolerance or held in the period' },
];

const schema = Yup.object({
  from: Yup.string().required('Give the first day of the period'),
  to: Yup.string()
    .required('Give the last day of the period')
    .test('after', 'The last day must be on or after the first', function (to) {
      return !to || !this.parent.from || to >= this.parent.from;
    }),
  scope: Yup.string().required(),
  kitId: Yup.string().when('scope', { is: 'kit', then: (s) => s.required('Pick a kit') }),
  type: Yup.string().when('scope', { is: 'type', then: (s) => s.required('Pick a type') }),
});

const toChoice = (v: Values): AuditPackChoice => ({
  from: v.from,
  to: v.to,
  scope: v.scope,
  ...(v.scope === 'kit' ? { kitId: v.kitId } : {}),
  ...(v.scope === 'type' ? { type: v.type } : {}),
});

function PackBuilder() {
  const { values, isValid } = useFormikContext<Values>();
  const choice = toChoice(values);
  const ready = isValid && schema.isValidSync(values);
  const preview = useAuditPackPreview(choice, ready);
  const { status, start, cancel } = useAuditPackDownload();
  const building = status.state === 'building';
  const estimate = preview.data?.estimatedBytes ?? 0;
  return (
    <div className="flex flex-col gap-3">
      {preview.isError ? (
        <Notice tone="error" title="The pack could not be counted">
          {preview.error.message}
        </Notice>
      ) : null}
      {ready && preview.data ? (
        <p className="text-sm text-ink-800" role="status">
          {preview.data.items === 0
            ? 'No item matches these choices, so the pack would hold only its summary and index.'
            : `${formatCount(preview.data.items)} item(s), ${formatCount(preview.data.calibrations)} calibration(s) with ${formatCount(preview.data.certificates)} certificate file(s); about ${formatFileSize(estimate)}.`}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="button" variant="primary" icon={<DownloadIcon size={16} />} disabled={!ready || building} onClick={() => start(choice)}>
          Build and download the pack
        </Button>
        {building ? (
          <Button type="button" variant="quiet" onClick={cancel}>
            Stop
          </Button>
        ) : null}
      </div>
      {status.state === 'building' ? (
        <div className="flex flex-col gap-1">
          <UploadProgress progress={estimate ? Math.min(0.99, status.receivedBytes / estimate) : 0} sending="Building the pack:" sent="" large />
          <p className="text-sm text-ink-700">
            {formatFileSize(status.receivedBytes)} of about {formatFileSize(estimate)} received
            {status.items !== null ? ` · records for ${formatCount(status.items)} item(s)` : ''}. Keep this page open; the file is saved when the last byte
            arrives.
          </p>
        </div>
      ) : null}
      {status.state === 'done' ? (
        <Notice tone="success" title="Pack saved">
          {status.fileName}, {formatFileSize(status.receivedBytes)}. Inside: records/ (one PDF per item), certificates/ (as stored), summary.pdf and index.csv
          with every file&apos;s SHA-256.
        </Notice>
      ) : null}
      {status.state === 'failed' ? (
        <Notice tone="error" title="The pack was not saved">
          {status.message}
        </Notice>
      ) : null}
    </div>
  );
}

/** The owner's audit pack: a period and a set of items, counted first, then built and received with progress. */
export function AuditPackForm({ kits, today }: { kits: { id: string; name: string }[]; today: string }) {
  const yearAgo = `${Number(today.slice(0, 4)) - 1}${today.slice(4)}`;
  return (
    <Formik<Values> initialValues={{ from: yearAgo, to: today, scope: 'all', kitId: '', type: '' }} validationSchema={schema} onSubmit={() => undefined}>
      {({ values }) => (
        <Form className="flex flex-col gap-4" noValidate>
          <div className="grid gap-3 sm:grid-cols-2">
            <DateField name="from" label="First day" />
            <DateField name="to" label="Last day" />
          </div>
          <SelectField name="scope" label="Items" options={scopeOptions} />
          {values.scope === 'kit' ? (
            <SelectField name="kitId" label="Kit" options={[{ value: '', label: 'Pick a kit' }, ...kits.map((k) => ({ value: k.id, label: k.name }))]} />
          ) : null}
          {values.scope === 'type' ? (
            <SelectField
              name="type"
              label="Type"
              options={[{ value: '', label: 'Pick a type' }, ...assetTypes.map((t) => ({ value: t, label: assetTypeTitles[t] }))]}
            />
          ) : null}
          <PackBuilder />
        </Form>
      )}
    </Formik>
  );
}
