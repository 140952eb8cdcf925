import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/button';
import { ScanIcon, SearchIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import { Link } from 'react-router-dom';
import { isApiError } from '../../../lib/api-client';
import { lookupAssetQueryOptions } from '../api/lookup-asset';
import type { AssetSuggestion, AssetView } from '../../../../shared/assets/views';

/** The near misses a look-up's 404 carries (`details.suggestions`). */
export const suggestionsIn = (error: unknown): AssetSuggestion[] =>
  isApiError(error) && error.status === 404 ? ((error.details as { suggestions?: AssetSuggestion[] } | undefined)?.suggestions ?? []) : [];
import { hasCamera, QrScanner } from './qr-scanner';

/**
 * Type an asset tag or RFID tag, or read the QR label with the camera; on a
 * match `onFound` gets the asset. Built for one hand on a phone: large text,
 * the controls low on the screen.
 */
export function FindByLabel({
  initialCode = '',
  initialProblem,
  initialSuggestions = [],
  onFound,
  lookup,
}: {
  initialCode?: string;
  initialProblem?: string;
  /** Near misses the server offered for `initialCode`. */
  initialSuggestions?: AssetSuggestion[];
  onFound: (asset: AssetView) => void;
  /** Where to look the code up; the server's lookup unless given (without signal: the phone's copy of the kit carried). */
  lookup?: (code: string) => Promise<AssetView>;
}) {
  const queryClient = useQueryClient();
  const inputId = useId();
  const [code, setCode] = useState(initialCode);
  const [problem, setProblem] = useState<string | undefined>(initialProblem);
  const [suggestions, setSuggestions] = useState<AssetSuggestion[]>(initialSuggestions);
  const [busy, setBusy] = useState(false);
  const [scanning, setScanning] = useState(false);
  const [scanAvailable, setScanAvailable] = useState(false);
  useEffect(() => {
    let live = true;
    void hasCamera().then((yes) => live && setScanAvailable(yes));
    return () => {
      live = false;
    };
  }, []);

  const find = async (value: string) => {
    const wanted = value.trim();
    if (!wanted) {
      setProblem('Type the asset tag or RFID tag first.');
      return;
    }
    setProblem(undefined);
    setSuggestions([]);
    setBusy(true);
    try {
      const asset = lookup ? await lookup(wanted) : await queryClient.fetchQuery(lookupAssetQueryOptions(wanted));
      onFound(asset);
    } catch (error) {
      setSuggestions(suggestionsIn(error));
      setProblem(
        isApiError(error) && error.code === 'not_found'
          ? `Nothing in your fleet matches “${wanted}”.`
          : isApiError(error)
            ? error.message
            : 'The search did not finish. Try again.',
      );
    } finally {
      setBusy(false);
    }
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    void find(code);
  };

  return (
    <div className="mx-auto flex min-h-[50dvh] max-w-md flex-col justify-end gap-4 sm:min-h-0 sm:justify-start">
      {problem ? (
        <Notice tone="error" title="Not found">
          {problem}
          {suggestions.length ? (
            <span className="mt-2 flex flex-wrap items-center gap-2">
              <span>Did you mean</span>
              {suggestions.map((s) => (
                <Link key={s.id} to={`/fleet/${s.id}`} className="font-mono font-semibold text-brass-deep underline whitespace-nowrap">
                  {s.assetTag}
                </Link>
              ))}
            </span>
          ) : null}
        </Notice>
      ) : null}
      {scanning ? (
        <QrScanner
          onClose={() => setScanning(false)}
          onCode={(value) => {
            setScanning(false);
            setCode(value);
            void find(value);
          }}
        />
      ) : null}
      <form onSubmit={submit} className="flex flex-col gap-3" role="search" aria-label="Find an asset by its label">
        <label htmlFor={inputId} className="text-lg font-semibold text-ink-900">
          Asset tag or RFID tag
        </label>
        <input
          id={inputId}
          value={code}
          onChange={(e) => setCode(e.target.value)}
          autoComplete="off"
          autoCapitalize="characters"
          spellCheck={false}
          enterKeyHint="search"
          className="min-h-14 w-full rounded-lg border-2 border-paper-line bg-card px-4 font-mono text-xl focus:border-brass-deep"
        />
        <Button type="submit" variant="primary" busy={busy} icon={<SearchIcon size={20} />} className="min-h-14 text-lg">
          Find
        </Button>
        {scanAvailable && !scanning ? (
          <Button icon={<ScanIcon size={20} />} className="min-h-14 text-lg" onClick={() => setScanning(true)}>
            Scan QR label
          </Button>
        ) : null}
      </form>
    </div>
  );
}
