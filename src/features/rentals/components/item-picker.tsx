import { useState } from 'react';
import { ItemMatches } from '../../../components/item-matches';
import { RemovableTags } from '../../../components/removable-tags';
import { SearchBox } from '../../../components/search-box';
import { assetTypeTitles } from '../../../lib/assets';
import { useDebouncedValue } from '../../../lib/use-debounced-value';
import { useAssetChoices } from '../api/get-asset-choices';
import type { AssetView } from '../../../../shared/assets/views';

/** An item on the rental beyond the kit's packing list, with the words to show for it. */
export interface ChosenItem {
  id: string;
  tag: string;
  detail: string;
}

export const chosenFrom = (a: Pick<AssetView, 'id' | 'assetTag' | 'model'> & { type?: AssetView['type'] }): ChosenItem => ({
  id: a.id,
  tag: a.assetTag,
  detail: [a.type ? assetTypeTitles[a.type] : null, a.model].filter(Boolean).join(' · '),
});

/** Search the fleet by tag, type or model and add separate items. */
export function ItemPicker({ chosen, kitId, onChange }: { chosen: ChosenItem[]; kitId: string; onChange: (items: ChosenItem[]) => void }) {
  const [q, setQ] = useState('');
  const needle = useDebouncedValue(q.trim(), 250);
  const found = useAssetChoices({ q: needle || undefined });
  const chosenIds = new Set(chosen.map((c) => c.id));
  const matches = needle ? (found.data?.items ?? []).filter((a) => a.status !== 'retired' && !chosenIds.has(a.id) && a.kit?.id !== kitId) : [];
  return (
    <div className="flex flex-col gap-2">
      <RemovableTags
        label="Separate items"
        items={chosen}
        onRemove={(id) => onChange(chosen.filter((c) => c.id !== id))}
      />
      <SearchBox label="Add separate items" value={q} onChange={setQ} placeholder="Tag, type or model, e.g. SMR" />
      {needle && found.data ? (
        <ItemMatches
          items={matches.map((a) => ({ ...chosenFrom(a), kitName: a.kit?.name }))}
          none={`No item to add matches “${needle}”.`}
          onAdd={(id) => onChange([...chosen, ...matches.filter((a) => a.id === id).map(chosenFrom)])}
        />
      ) : null}
      {found.isError ? <p className="text-sm text-bad">{found.error.message}</p> : null}
    </div>
  );
}
