import { useId } from 'react';
import { assetTypes, assetTypeTitles, type AssetType } from '../lib/assets';

/** A labelled choice of one asset type, or none (`anyLabel`: "All types"). */
export function AssetTypeSelect({
  label,
  anyLabel,
  value,
  onChange,
  className = '',
}: {
  label: string;
  anyLabel: string;
  value: AssetType | '';
  onChange: (type: AssetType | '') => void;
  className?: string;
}) {
  const id = useId();
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-semibold text-ink-800">
        {label}
      </label>
      <select
        id={id}
        value={value}
        onChange={(e) => onChange(e.target.value as AssetType | '')}
        className="min-h-10 rounded-md border border-paper-line bg-card px-2 text-base text-ink-900"
      >
        <option value="">{anyLabel}</option>
        {assetTypes.map((t) => (
          <option key={t} value={t}>
            {assetTypeTitles[t]}
          </option>
        ))}
      </select>
    </div>
  );
}
