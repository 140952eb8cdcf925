import { useEffect, useId, useMemo, useRef } from 'react';
import { CrossIcon } from '../../../components/icons';
import { formatFileSize } from '../../../lib/format';
import { isHeic, MAX_PHOTOS, PHOTO_ACCEPT } from './photo-rules';

function FileGlyph() {
  return (
    <svg width="36" height="36" viewBox="0 0 24 24" aria-hidden="true" className="text-ink-700">
      <path d="M6 2h8l5 5v15H6z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
      <path d="M14 2v5h5" fill="none" stroke="currentColor" strokeWidth="1.6" />
      <circle cx="10" cy="13" r="1.6" fill="currentColor" />
      <path d="M7.5 19l3.5-4 2.5 2.5 1.5-1.5 2.5 3" fill="none" stroke="currentColor" strokeWidth="1.4" />
    </svg>
  );
}

/** "Photos": the camera or the gallery, up to six, each previewed (HEIC as a file) and removable. */
export function PhotoPicker({
  files,
  onChange,
  problems,
  label = 'Photos',
}: {
  files: File[];
  onChange: (files: File[]) => void;
  problems: string[];
  label?: string;
}) {
  const id = useId();
  const input = useRef<HTMLInputElement>(null);
  const previews = useMemo(() => files.map((f) => (isHeic(f) ? null : URL.createObjectURL(f))), [files]);
  useEffect(() => () => previews.forEach((u) => u && URL.revokeObjectURL(u)), [previews]);
  const full = files.length >= MAX_PHOTOS;

  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={id} className="text-lg font-bold text-ink-900">
        {label}
      </label>
      <p id={`${id}-hint`} className="text-base text-ink-700">
        Up to {MAX_PHOTOS} photos (JPEG, PNG or HEIC, at most 10 MB each): the damage close up, the whole item, its label.
      </p>
      <input
        ref={input}
        id={id}
        type="file"
        name="photos"
        accept={PHOTO_ACCEPT}
        multiple
        capture="environment"
        disabled={full}
        aria-describedby={`${id}-hint`}
        onChange={(e) => {
          const picked = Array.from(e.target.files ?? []);
          onChange([...files, ...picked]);
          e.target.value = '';
        }}
        className="block w-full rounded-md border-2 border-ink-700 bg-card p-2 text-base file:mr-3 file:min-h-11 file:rounded-md file:border-0 file:bg-ink-900 file:px-4 file:text-base file:font-bold file:text-card disabled:opacity-60"
      />
      {problems.length ? (
        <ul role="alert" className="flex flex-col gap-1 rounded-md border-2 border-bad bg-bad-wash p-2 text-base text-ink-900">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}
      {files.length ? (
        <ul className="grid grid-cols-3 gap-2" aria-label="Chosen photos">
          {files.map((f, i) => (
            <li key={`${f.name}-${i}`} className="relative flex flex-col items-center gap-1 rounded-md border border-paper-line bg-card p-1">
              {previews[i] ? (
                <img src={previews[i] ?? undefined} alt={`Photo ${i + 1}: ${f.name}`} className="aspect-square w-full rounded object-cover" />
              ) : (
                <span className="flex aspect-square w-full items-center justify-center">
                  <FileGlyph />
                </span>
              )}
              <span className="w-full truncate text-center text-xs text-ink-700">
                {f.name} · {formatFileSize(f.size)}
              </span>
              <button
                type="button"
                onClick={() => onChange(files.filter((_, j) => j !== i))}
                aria-label={`Remove photo ${i + 1} (${f.name})`}
                className="absolute top-1 right-1 flex size-9 items-center justify-center rounded-full border border-paper-line bg-card/95 text-ink-900"
              >
                <CrossIcon size={16} />
              </button>
            </li>
          ))}
        </ul>
      ) : null}
      {full ? <p className="text-base text-ink-700">That is the most one report takes.</p> : null}
    </div>
  );
}
