import { useState } from 'react';
import { Button } from '../../components/button';
import { Dialog } from '../../components/dialog';
import { PlusIcon } from '../../components/icons';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { Panel } from '../../components/panel';
import { useSession } from '../../features/auth/components/session-context';
import { useCustomers } from '../../features/rentals/api/get-customers';
import { useRateCards } from '../../features/rentals/api/get-rate-cards';
import type { RateCardView } from '../../../shared/billing/views';
import { CustomerDialog } from '../../features/rentals/components/customer-dialog';
import { CustomersTable } from '../../features/rentals/components/customers-table';
import { RateCardForm } from '../../features/rentals/components/rate-card-form';
import { RateCardsTable } from '../../features/rentals/components/rate-cards-table';
import { useKits } from '../../features/kits/api/get-kits';
import { can } from '../../lib/roles';

/** Who rents, and at what rates: the ground every rental's price stands on. */
export default function CustomersRoute() {
  const { user, organization } = useSession();
  const customers = useCustomers();
  const cards = useRateCards();
  const kits = useKits();
  const canEditCustomers = can(user.role, 'customers.write');
  const canEditRates = can(user.role, 'rentals.write');
  const [addingCustomer, setAddingCustomer] = useState(false);
  const [card, setCard] = useState<RateCardView | 'new' | null>(null);
  const [saved, setSaved] = useState<string>();
  const kitList = kits.data?.items ?? [];
  const error = customers.error ?? cards.error ?? kits.error;

  return (
    <>
      <PageHeader title="Customers and rates" description="The firms that rent kit, and the day, week and month rates rentals are priced with." />
      {saved ? (
        <Notice tone="success" className="mb-3">
          {saved}
        </Notice>
      ) : null}
      {error ? (
        <Notice tone="error" className="mb-3">
          {error.message}
        </Notice>
      ) : null}
      <div className="flex flex-col gap-5">
        <Panel
          title="Customers"
          actions={
            canEditCustomers ? (
              <Button variant="primary" size="sm" icon={<PlusIcon size={14} />} onClick={() => setAddingCustomer(true)}>
                New customer
              </Button>
            ) : null
          }
        >
          <CustomersTable customers={customers.data?.items} />
        </Panel>
        <Panel
          title="Rates"
          id="rates"
          actions={
            canEditRates ? (
              <Button variant="primary" size="sm" icon={<PlusIcon size={14} />} onClick={() => setCard('new')}>
                New rates
              </Button>
            ) : null
          }
        >
          <p className="mb-2 text-sm text-ink-700">
            Items rent at their type&rsquo;s rates. A kit with rates of its own rents as one line; its items are not priced one by one.
          </p>
          <RateCardsTable cards={cards.data?.items} kits={kitList} currency={organization.currency} onOpen={canEditRates ? setCard : undefined} />
        </Panel>
      </div>

      <CustomerDialog
        open={addingCustomer}
        onClose={() => setAddingCustomer(false)}
        onSaved={(c) => {
          setSaved(`${c.company} is saved.`);
          setAddingCustomer(false);
        }}
      />
      <Dialog open={card !== null} onClose={() => setCard(null)} title={card === 'new' ? 'New rates' : 'Change rates'} size="lg">
        {card ? (
          <RateCardForm
            card={card === 'new' ? undefined : card}
            kits={kitList}
            currency={organization.currency}
            onSaved={() => {
              setSaved('The rates are saved.');
              setCard(null);
            }}
            onCancel={() => setCard(null)}
          />
        ) : null}
      </Dialog>
    </>
  );
}
