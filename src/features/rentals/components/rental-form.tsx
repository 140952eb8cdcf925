import { Form, Formik, useFormikContext, type FormikHelpers } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import type { AssetView } from '../../../../shared/assets/views';
import type { RentalView } from '../../../../shared/billing/views';
import type { AlternativeItem } from '../../../../shared/bookings/views';
import { BookingRefusalPanel, bookingRefusalFrom, type BookingRefusal } from '../../../components/booking-refusal';
import { Button } from '../../../components/button';
import { DayRangeFields } from '../../../components/day-range-fields';
import { Dialog } from '../../../components/dialog';
import { Field, SelectField } from '../../../components/field';
import { FormSection } from '../../../components/form-section';
import { PlusIcon } from '../../../components/icons';
import type { ChosenItem, FleetPages } from '../../../components/item-picker';
import { KitAndItemsFields, swapIn, useKitMembers } from '../../../components/kit-and-items';
import { Notice } from '../../../components/notice';
import { dayRangeRules } from '../../../lib/day-range';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCreateRental, type RentalInput } from '../api/create-rental';
import { useCustomers } from '../api/get-customers';
import type { RentalScope } from '../api/keys';
import { CustomerForm } from './customer-form';
import { LiveQuote } from './live-quote';

export interface RentalValues {
  customerId: string;
  kitId: string;
  items: ChosenItem[];
  startsOn: string;
  endsOn: string;
  note: string;
}

const fields = ['customerId', 'kitId', 'items', 'startsOn', 'endsOn', 'note'];
const labels = { customerId: 'Customer', kitId: 'Kit', items: 'Items', startsOn: 'Starts on', endsOn: 'Ends on' };
const aliases = { assetIds: 'items' };
const MAX_DAYS = 400;

const schema = Yup.object({
  customerId: Yup.string().required('Pick the customer, or add a new one.'),
  items: Yup.array().test('something', 'Choose a kit or add at least one item.', function (value) {
    return (value?.length ?? 0) > 0 || !!(this.parent as RentalValues).kitId;
  }),
  ...dayRangeRules({ first: 'Pick the first rental day.', last: 'Pick the last rental day.', what: 'A rental' }, MAX_DAYS),
  note: Yup.string().max(2000, 'Keep the note to 2000 characters.'),
});

/** What the values ask to rent, once they say what and when (the quote and the rental both take it). */
function scopeOf(v: RentalValues): RentalScope | null {
  if (!v.startsOn || !v.endsOn || v.startsOn > v.endsOn || (!v.kitId && !v.items.length)) return null;
  return {
    startsOn: v.startsOn,
    endsOn: v.endsOn,
    ...(v.kitId ? { kitId: v.kitId } : {}),
    ...(v.items.length ? { assetIds: v.items.map((i) => i.id) } : {}),
    ...(v.customerId ? { customerId: v.customerId } : {}),
  };
}

/** A new rental: customer, a kit and/or items, whole days; the price follows every change. `fleet` reads the fleet a page at a time (the fleet feature's list). */
export function RentalForm({
  kits,
  fleet,
  initial,
  onCreated,
}: {
  kits: { id: string; name: string }[];
  fleet: FleetPages<AssetView>;
  initial: Partial<RentalValues>;
  onCreated: (rental: RentalView) => void;
}) {
  const create = useCreateRental();
  const [formError, setFormError] = useState<string>();
  const [refusal, setRefusal] = useState<BookingRefusal | null>(null);
  const initialValues: RentalValues = {
    customerId: initial.customerId ?? '',
    kitId: initial.kitId ?? '',
    items: [],
    startsOn: initial.startsOn ?? '',
    endsOn: initial.endsOn ?? initial.startsOn ?? '',
    note: '',
  };

  async function submit(values: RentalValues, helpers: FormikHelpers<RentalValues>) {
    setFormError(undefined);
    setRefusal(null);
    const scope = scopeOf(values);
    if (!scope) return;
    const input: RentalInput = { ...scope, customerId: values.customerId, ...(values.note.trim() ? { note: values.note.trim() } : {}) };
    try {
      onCreated(await create.mutateAsync(input));
    } catch (error) {
      const refused = bookingRefusalFrom(error);
      if (refused) setRefusal(refused);
      else setFormError(applyServerErrors(error, helpers, { fields, labels, aliases }));
    }
  }

  return (
    <Formik initialValues={initialValues} validationSchema={schema} onSubmit={submit}>
      {({ isSubmitting }) => (
        <RentalFormBody kits={kits} fleet={fleet} formError={formError} refusal={refusal} busy={isSubmitting} onSwapped={() => setRefusal(null)} />
      )}
    </Formik>
  );
}

function RentalFormBody({
  kits,
  fleet,
  formError,
  refusal,
  busy,
  onSwapped,
}: {
  kits: { id: string; name: string }[];
  fleet: FleetPages<AssetView>;
  formError?: string;
  refusal: BookingRefusal | null;
  busy: boolean;
  onSwapped: () => void;
}) {
  const { values, setFieldValue, setValues } = useFormikContext<RentalValues>();
  const customers = useCustomers();
  const { members, error: membersError } = useKitMembers(fleet, values.kitId);
  const [newCustomerOpen, setNewCustomerOpen] = useState(false);
  const [swapNote, setSwapNote] = useState<string>();
  const scope = scopeOf(values);

  const customerOptions = [{ value: '', label: 'Choose the customer' }, ...(customers.data?.items ?? []).map((c) => ({ value: c.id, label: c.company }))];

  /** Puts the offered item in place of the refused one (a kit is then listed item by item) for the person to review; only "Create rental" books. */
  function swap(refusedId: string, alternative: AlternativeItem) {
    const { items, from = 'the refused item' } = swapIn(members, values, refusedId, alternative);
    void setValues({ ...values, kitId: '', items }, true);
    setSwapNote(
      `${alternative.assetTag} replaces ${from}.${values.kitId ? ' The rental now lists the kit’s items one by one, with the swap.' : ''} Check the items and the price, then create the rental.`,
    );
    onSwapped();
  }

  return (
    <>
      <Form noValidate className="flex flex-col gap-4" aria-label="New rental">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
        {customers.isError ? <Notice tone="error">{customers.error.message}</Notice> : null}

        <FormSection legend="Who rents">
          <div className="flex flex-wrap items-end gap-2">
            <SelectField name="customerId" label="Customer" options={customerOptions} className="min-w-64 flex-1" />
            <Button icon={<PlusIcon size={16} />} onClick={() => setNewCustomerOpen(true)}>
              New customer
            </Button>
          </div>
        </FormSection>

        <FormSection legend="What goes">
          <KitAndItemsFields kits={kits} fleet={fleet} members={members} membersError={membersError} kitHint="A kit rents every item on its packing list." />
        </FormSection>

        <FormSection legend="When">
          <DayRangeFields />
          <Field name="note" label="Note" hint="Anything the person at the counter should know." autoComplete="off" />
        </FormSection>

        <LiveQuote scope={scope} />

        {refusal ? <BookingRefusalPanel refusal={refusal} onSwap={swap} /> : null}
        {swapNote && !refusal ? <Notice tone="info">{swapNote}</Notice> : null}

        <div className="flex flex-wrap gap-2">
          <Button type="submit" variant="primary" busy={busy}>
            Create rental
          </Button>
        </div>
      </Form>

      <Dialog open={newCustomerOpen} onClose={() => setNewCustomerOpen(false)} title="New customer" size="lg">
        <CustomerForm
          onSaved={(customer) => {
            void setFieldValue('customerId', customer.id);
            setNewCustomerOpen(false);
          }}
          onCancel={() => setNewCustomerOpen(false)}
        />
      </Dialog>
    </>
  );
}
