import { useQuery } from '@tanstack/react-query';
import { useFormikContext } from 'formik';
import type { AssetView } from '../../shared/assets/views';
import type { AlternativeItem } from '../../shared/bookings/views';
import { SelectField } from './field';
import { FieldMessage } from './field-message';
import { ItemPicker, type ChosenItem, type FleetPages } from './item-picker';
import { Notice } from './notice';
import { PackingListLine } from './packing-list-line';

/** What a booking or rental form holds about what goes: a kit and/or separate items. */
export interface KitAndItems {
  kitId: string;
  items: ChosenItem[];
}

/** The chosen kit's packing list from the server: every member, retired ones too (a kit goes with all its members, and the forms say why one cannot). */
export function useKitMembers(fleet: FleetPages<AssetView>, kitId: string) {
  const query = useQuery({ ...fleet({ kitId, sort: 'assetTag', limit: 500, offset: 0 }), enabled: !!kitId });
  return { members: kitId ? (query.data?.items ?? []) : [], error: query.error };
}

/**
 * The items with `alternative` in place of the refused one; a kit is listed
 * item by item from then on (the caller clears `kitId`). `from` is the refused item's tag.
 */
export function swapIn(
  members: AssetView[],
  values: KitAndItems,
  refusedId: string,
  alternative: AlternativeItem,
): { items: ChosenItem[]; from: string | undefined } {
  const all: ChosenItem[] = [...members, ...values.items.filter((i) => !members.some((m) => m.id === i.id))];
  const swapped = all.map((i) => (i.id === refusedId ? alternative : i));
  // The alternative may be on the list already.
  return { items: swapped.filter((i, n) => swapped.findIndex((o) => o.id === i.id) === n), from: all.find((i) => i.id === refusedId)?.assetTag };
}

/** "What goes" on a booking or rental form: the kit with its packing list, and separate items from the fleet. */
export function KitAndItemsFields({
  kits,
  fleet,
  members,
  membersError,
  kitHint,
}: {
  kits: { id: string; name: string }[];
  fleet: FleetPages<AssetView>;
  members: AssetView[];
  membersError: Error | null;
  kitHint: string;
}) {
  const { values, setFieldValue } = useFormikContext<KitAndItems>();
  const kitOptions = [{ value: '', label: 'No kit: separate items only' }, ...kits.map((k) => ({ value: k.id, label: k.name }))];
  return (
    <>
      <SelectField name="kitId" label="Kit" options={kitOptions} hint={kitHint} />
      <PackingListLine tags={members.map((m) => m.assetTag)} />
      {membersError ? <Notice tone="error">{membersError.message}</Notice> : null}
      <ItemPicker
        pages={fleet}
        chosen={values.items.filter((i) => !members.some((m) => m.id === i.id))}
        kitId={values.kitId}
        onAdd={(item) => void setFieldValue('items', [...values.items, item])}
        onRemove={(id) =>
          void setFieldValue(
            'items',
            values.items.filter((i) => i.id !== id),
          )
        }
      />
      <FieldMessage name="items" />
    </>
  );
}
