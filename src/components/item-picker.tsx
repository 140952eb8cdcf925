import { useQuery, type UseQueryOptions } from '@tanstack/react-query';
import { useState } from 'react';
import type { AssetView } from '../../shared/assets/views';
import type { AlternativeItem } from '../../shared/bookings/views';
import type { Page } from '../../shared/lists/page';
import { assetTypeTitles, type AssetStatus, type AssetType } from '../lib/assets';
import { formatCount } from '../lib/format';
import { useDebouncedValue } from '../lib/use-debounced-value';
import { AssetTypeSelect } from './asset-type-select';
import { Button } from './button';
import { ItemMatches } from './item-matches';
import { RemovableTags } from './removable-tags';
import { SearchBox } from './search-box';

/** The part of `GET /api/assets` the forms ask for: a search, or a kit's packing list (the fleet feature's list options take it as is). */
export interface FleetQuery {
  q?: string;
  type?: AssetType[];
  status?: AssetStatus[];
  kitId?: string;
  sort?: string;
  limit: number;
  offset: number;
}

/** One page of the fleet, as query options of the feature that owns `GET /api/assets`; a screen passes them in. The key is that feature's own. */
// `any` key: each feature's own key factory types its keys; the picker only passes the options on.
export type FleetPages<T> = (query: FleetQuery) => UseQueryOptions<Page<T>, Error, Page<T>, any>;

/** What the picker shows of an item; an alternative the server offered may lack its type and kit. */
export interface PickableItem {
  id: string;
  assetTag: string;
  type?: AssetType;
  model: string | null;
  kit?: { id: string; name: string } | null;
  status?: AssetStatus;
}

/** Items the booking rule refuses whatever the dates: shown as such in the search, before any dates are picked. */
const unavailableWords: Partial<Record<AssetStatus, string>> = { held: 'On hold', at_lab: 'At the calibration lab' };

/** A separate item on a booking or rental form: read from the fleet, or an alternative the server offered in place of a refused one. */
export type ChosenItem = AssetView | AlternativeItem;

/** Only items read from the fleet carry what the booking rules look at; an offered alternative is free and valid by the server's word. */
export const readFromFleet = (item: ChosenItem): item is AssetView => 'status' in item;

const PAGE_SIZE = 8;
/** Everything but retired items: those never go out again. */
const inService: AssetStatus[] = ['ready', 'out', 'at_lab', 'held'];

export const itemDetail = (item: PickableItem) => [item.type ? assetTypeTitles[item.type] : null, item.model].filter(Boolean).join(' · ');

/**
 * Separate items for a booking or a rental, beyond a kit's packing list: the
 * server searches the whole fleet by tag, type or model (and a type, when one
 * is picked), a page at a time. Items already chosen or on the chosen kit's
 * list show as such instead of an "Add" button.
 */
export function ItemPicker<T extends PickableItem>({
  pages,
  chosen,
  kitId,
  onAdd,
  onRemove,
}: {
  pages: FleetPages<T>;
  chosen: PickableItem[];
  /** The kit on the form: its members go with it already. */
  kitId: string;
  onAdd: (item: T) => void;
  onRemove: (id: string) => void;
}) {
  const [text, setText] = useState('');
  const [type, setType] = useState<AssetType | ''>('');
  const q = useDebouncedValue(text.trim(), 250);
  const asking = !!(q || type);
  // A new search starts on its first page.
  const search = `${type}|${q}`;
  const [paging, setPaging] = useState({ search, offset: 0 });
  const offset = paging.search === search ? paging.offset : 0;
  const setOffset = (next: number) => setPaging({ search, offset: next });
  const found = useQuery({
    ...pages({ q: q || undefined, type: type ? [type] : undefined, status: inService, sort: 'assetTag', limit: PAGE_SIZE, offset }),
    enabled: asking,
  });
  const chosenIds = new Set(chosen.map((c) => c.id));
  const page = asking ? found.data : undefined;
  const total = page?.total ?? 0;

  return (
    <div className="flex flex-col gap-2">
      <RemovableTags label="Separate items" items={chosen.map((c) => ({ id: c.id, tag: c.assetTag, detail: itemDetail(c) }))} onRemove={onRemove} />
      <div className="flex flex-wrap items-end gap-2">
        <SearchBox label="Add separate items" value={text} onChange={setText} placeholder="Tag, type or model, e.g. SMR" className="min-w-56 flex-[2]" />
        <AssetTypeSelect label="Item type" anyLabel="Any type" value={type} onChange={setType} className="min-w-40 flex-1" />
      </div>
      {page ? (
        <>
          <ItemMatches
            items={page.items.map((item) => ({
              id: item.id,
              tag: item.assetTag,
              detail: itemDetail(item),
              kitName: item.kit?.name,
              note: chosenIds.has(item.id) ? 'Added' : kitId && item.kit?.id === kitId ? 'On the kit' : item.status ? unavailableWords[item.status] : undefined,
            }))}
            none={
              q
                ? `No item in service matches “${q}”${type ? ` among ${assetTypeTitles[type].toLowerCase()}s` : ''}.`
                : `No ${assetTypeTitles[type as AssetType].toLowerCase()} in service.`
            }
            onAdd={(id) => {
              const item = page.items.find((i) => i.id === id);
              if (item) onAdd(item);
            }}
          />
          {total > PAGE_SIZE ? (
            <div className="flex flex-wrap items-center gap-2 text-sm text-ink-700" aria-live="polite">
              <span>
                {formatCount(offset + 1)}–{formatCount(Math.min(offset + PAGE_SIZE, total))} of {formatCount(total)} matches
              </span>
              <Button size="sm" variant="quiet" disabled={offset === 0} onClick={() => setOffset(Math.max(0, offset - PAGE_SIZE))}>
                Previous
              </Button>
              <Button size="sm" variant="quiet" disabled={offset + PAGE_SIZE >= total} onClick={() => setOffset(offset + PAGE_SIZE)}>
                Next
              </Button>
            </div>
          ) : null}
        </>
      ) : null}
      {asking && found.isError ? <p className="text-sm text-bad">{found.error.message}</p> : null}
    </div>
  );
}
