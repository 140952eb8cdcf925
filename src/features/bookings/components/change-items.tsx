import { useState } from 'react';
import { BookingRefusalPanel, bookingRefusalFrom } from '../../../components/booking-refusal';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { ItemPicker, type ChosenItem, type FleetPages } from '../../../components/item-picker';
import { Notice } from '../../../components/notice';
import { assetTypeTitles } from '../../../lib/assets';
import type { AssetView } from '../../../../shared/assets/views';
import type { BookingView } from '../../../../shared/bookings/views';
import { useChangeBookingItems } from '../api/change-booking-items';

/**
 * "Change items" on a reserved booking: take items off, add others (a swap is both at once). Added items
 * pass the same refusals as booking; a refusal offers free, valid items of the same type to use instead.
 */
export function ChangeItemsButton({ booking, fleet }: { booking: BookingView; fleet: FleetPages<AssetView> }) {
  const [open, setOpen] = useState(false);
  const [adding, setAdding] = useState<ChosenItem[]>([]);
  const [removing, setRemoving] = useState<string[]>([]);
  const change = useChangeBookingItems();
  const refusal = change.isError ? bookingRefusalFrom(change.error) : null;
  const keeps = booking.items.length - removing.length + adding.length;

  function start() {
    change.reset();
    setAdding([]);
    setRemoving([]);
    setOpen(true);
  }

  return (
    <>
      <Button onClick={start}>Change items</Button>
      <Dialog
        open={open}
        onClose={() => setOpen(false)}
        size="lg"
        title="Change items"
        description="Take items off, add others, or both to swap. Added items must be free and in calibration for the booking's days."
      >
        <div className="flex flex-col gap-4">
          <section aria-labelledby="on-booking">
            <h3 id="on-booking" className="mb-1 font-semibold">
              On the booking
            </h3>
            <ul className="flex flex-col divide-y divide-paper-line rounded-md border border-paper-line">
              {booking.items.map((item) => {
                const off = removing.includes(item.id);
                return (
                  <li key={item.id} className="flex min-h-11 items-center gap-2 px-2 py-1">
                    <span className={`font-mono text-sm font-semibold ${off ? 'text-ink-500 line-through' : ''}`}>{item.assetTag}</span>
                    <span className="min-w-0 flex-1 truncate text-sm text-ink-700">
                      {assetTypeTitles[item.type]}
                      {off ? ' · comes off' : ''}
                    </span>
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-pressed={off}
                      onClick={() => setRemoving(off ? removing.filter((id) => id !== item.id) : [...removing, item.id])}
                    >
                      {off ? `Keep ${item.assetTag}` : `Take off ${item.assetTag}`}
                    </Button>
                  </li>
                );
              })}
            </ul>
          </section>
          <ItemPicker
            pages={fleet}
            chosen={adding}
            kitId=""
            onAdd={(item) => {
              change.reset();
              if (booking.assetIds.includes(item.id)) setRemoving(removing.filter((id) => id !== item.id));
              else setAdding([...adding, item]);
            }}
            onRemove={(id) => setAdding(adding.filter((a) => a.id !== id))}
          />
          {refusal ? (
            <BookingRefusalPanel
              refusal={refusal}
              onSwap={(refusedId, alternative) => {
                change.reset();
                setAdding([...adding.filter((a) => a.id !== refusedId), alternative]);
              }}
            />
          ) : change.isError ? (
            <Notice tone="error">{change.error.message}</Notice>
          ) : null}
          {keeps === 0 ? <Notice tone="caution">A booking keeps at least one item; cancel it instead.</Notice> : null}
          <div className="flex flex-wrap gap-2">
            <Button
              variant="primary"
              busy={change.isPending}
              disabled={keeps === 0 || (!adding.length && !removing.length)}
              onClick={() => change.mutate({ id: booking.id, add: adding.map((a) => a.id), remove: removing }, { onSuccess: () => setOpen(false) })}
            >
              Save items
            </Button>
            <Button variant="quiet" onClick={() => setOpen(false)}>
              Keep the items
            </Button>
          </div>
        </div>
      </Dialog>
    </>
  );
}
