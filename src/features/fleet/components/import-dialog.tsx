import { useId, useState } from 'react';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { UploadIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';
import { formatCount } from '../../../lib/format';
import { importTemplateUrl, useImportAssets } from '../api/import-assets';
import type { AssetImportResult, ImportProblem } from '../../../../shared/assets/views';
import { UploadProgress } from '../../../components/upload-progress';

type Step =
  | { kind: 'pick' }
  | { kind: 'uploading'; mode: 'preview' | 'commit'; progress: number }
  | { kind: 'checked'; result: AssetImportResult }
  | { kind: 'done'; created: number }
  | { kind: 'failed'; message: string; problems?: ImportProblem[]; result?: AssetImportResult };

function problemsFrom(error: unknown): ImportProblem[] | undefined {
  if (!isApiError(error) || error.code !== 'import_invalid') return undefined;
  const errors = (error.details as { errors?: unknown } | undefined)?.errors;
  return Array.isArray(errors) ? (errors as ImportProblem[]) : undefined;
}

function ProblemsTable({ problems }: { problems: ImportProblem[] }) {
  return (
    <div className="max-h-64 overflow-auto rounded-md border border-bad/40">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Problems found in the file</caption>
        <thead className="sticky top-0 bg-bad-wash">
          <tr>
            <th scope="col" className="px-2 py-1">
              Row
            </th>
            <th scope="col" className="px-2 py-1">
              Column
            </th>
            <th scope="col" className="px-2 py-1">
              What is wrong
            </th>
          </tr>
        </thead>
        <tbody>
          {problems.map((p, i) => (
            <tr key={`${p.row}-${p.column}-${i}`} className="border-t border-paper-line">
              <td className="px-2 py-1 font-mono">{p.row}</td>
              <td className="px-2 py-1 font-mono">{p.column || '—'}</td>
              <td className="px-2 py-1">{p.message}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function PreviewTable({ result }: { result: AssetImportResult }) {
  if (!result.preview.length) return null;
  return (
    <div className="max-h-72 overflow-auto rounded-md border border-paper-line">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">First rows of the file</caption>
        <thead className="sticky top-0 bg-paper-deep">
          <tr>
            {['Row', 'Type', 'Asset tag', 'Serial', 'Maker', 'Model', 'Kit'].map((h) => (
              <th key={h} scope="col" className="px-2 py-1 whitespace-nowrap">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {result.preview.map((r) => (
            <tr key={r.row} className="border-t border-paper-line">
              <td className="px-2 py-1 font-mono">{r.row}</td>
              <td className="px-2 py-1">{r.type}</td>
              <td className="px-2 py-1 font-mono whitespace-nowrap">{r.assetTag}</td>
              <td className="px-2 py-1 font-mono">{r.serialNumber}</td>
              <td className="px-2 py-1">{r.manufacturer ?? '—'}</td>
              <td className="px-2 py-1">{r.model ?? '—'}</td>
              <td className="px-2 py-1">{r.kit ?? '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {result.rowCount > result.preview.length ? (
        <p className="border-t border-paper-line px-2 py-1 text-sm text-ink-700">
          Showing the first {result.preview.length} of {formatCount(result.rowCount)} rows.
        </p>
      ) : null}
    </div>
  );
}

/**
 * Import a CSV file of assets: the file is checked first (nothing written),
 * then imported as a whole — if any row is wrong, no row is written.
 */
export function ImportDialog({ open, onClose, onImported }: { open: boolean; onClose: () => void; onImported: (created: number) => void }) {
  const importAssets = useImportAssets();
  const fileId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [step, setStep] = useState<Step>({ kind: 'pick' });

  const reset = () => {
    setFile(null);
    setStep({ kind: 'pick' });
  };
  const close = () => {
    if (step.kind === 'uploading') return;
    reset();
    onClose();
  };

  const send = async (chosen: File, mode: 'preview' | 'commit') => {
    setStep({ kind: 'uploading', mode, progress: 0 });
    try {
      const result = await importAssets.mutateAsync({
        file: chosen,
        mode,
        onProgress: (progress) => setStep({ kind: 'uploading', mode, progress }),
      });
      if (mode === 'commit') {
        setStep({ kind: 'done', created: result.created });
        onImported(result.created);
      } else setStep({ kind: 'checked', result });
    } catch (error) {
      setStep({
        kind: 'failed',
        message: isApiError(error) ? error.message : 'The file could not be sent. Try again.',
        problems: problemsFrom(error),
      });
    }
  };

  const checked = step.kind === 'checked' ? step.result : null;

  return (
    <Dialog
      open={open}
      onClose={close}
      size="lg"
      title="Import assets"
      description={
        <>
          One asset per row, with a header row naming the columns.{' '}
          <a href={importTemplateUrl()} className="font-semibold text-brass-deep underline" download>
            Download the template
          </a>{' '}
          to see the columns and two example rows. The file is checked first; nothing is written until you import it, and if any row is wrong, no row is
          written.
        </>
      }
    >
      <div className="flex flex-col gap-4">
        <div className="flex flex-col gap-1">
          <label htmlFor={fileId} className="text-sm font-semibold text-ink-800">
            CSV file
          </label>
          <input
            id={fileId}
            type="file"
            accept=".csv,text/csv"
            disabled={step.kind === 'uploading'}
            onChange={(e) => {
              const chosen = e.target.files?.[0] ?? null;
              setFile(chosen);
              if (chosen) void send(chosen, 'preview');
              else setStep({ kind: 'pick' });
            }}
            className="min-h-10 rounded-md border border-paper-line bg-card px-2 py-1.5 text-base file:mr-3 file:rounded file:border-0 file:bg-paper-deep file:px-3 file:py-1 file:font-semibold"
          />
        </div>

        {step.kind === 'uploading' ? (
          <UploadProgress
            progress={step.progress}
            sending={step.mode === 'preview' ? 'Sending the file to be checked…' : 'Importing…'}
            sent={step.mode === 'preview' ? 'Sent; checking every row…' : 'Sent; importing every row…'}
          />
        ) : null}

        {checked ? (
          <>
            {checked.valid ? (
              <Notice tone="success" title="The file is ready to import">
                {formatCount(checked.rowCount)} {checked.rowCount === 1 ? 'asset' : 'assets'} found, no problems.
              </Notice>
            ) : (
              <Notice tone="error" title={`${formatCount(checked.errors.length)} ${checked.errors.length === 1 ? 'problem' : 'problems'} to fix first`}>
                Correct these rows in the file and choose it again. Nothing has been written.
              </Notice>
            )}
            {checked.errors.length ? <ProblemsTable problems={checked.errors} /> : null}
            <PreviewTable result={checked} />
          </>
        ) : null}

        {step.kind === 'failed' ? (
          <>
            <Notice tone="error" title="Nothing was imported">
              {step.message}
            </Notice>
            {step.problems?.length ? <ProblemsTable problems={step.problems} /> : null}
          </>
        ) : null}

        {step.kind === 'done' ? (
          <Notice tone="success" title="Import finished">
            {formatCount(step.created)} {step.created === 1 ? 'asset was' : 'assets were'} added to the fleet.
          </Notice>
        ) : null}

        <div className="flex flex-wrap justify-end gap-2">
          {step.kind === 'done' ? (
            <>
              <Button onClick={reset}>Import another file</Button>
              <Button variant="primary" onClick={close}>
                Close
              </Button>
            </>
          ) : (
            <>
              <Button onClick={close} disabled={step.kind === 'uploading'}>
                Cancel
              </Button>
              <Button
                variant="primary"
                icon={<UploadIcon size={16} />}
                busy={step.kind === 'uploading' && step.mode === 'commit'}
                disabled={!file || !checked?.valid || checked.rowCount === 0}
                onClick={() => file && void send(file, 'commit')}
              >
                {checked?.valid ? `Import ${formatCount(checked.rowCount)} ${checked.rowCount === 1 ? 'asset' : 'assets'}` : 'Import assets'}
              </Button>
            </>
          )}
        </div>
      </div>
    </Dialog>
  );
}
