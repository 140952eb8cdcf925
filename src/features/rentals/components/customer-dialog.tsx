import { Dialog } from '../../../components/dialog';
import type { CustomerView } from '../../../../shared/billing/views';
import { CustomerForm } from './customer-form';

/** New customer (no `customer`) or change one. The form mounts only while open, so it starts from the customer as saved. */
export function CustomerDialog({
  open,
  customer,
  onClose,
  onSaved,
}: {
  open: boolean;
  customer?: CustomerView;
  onClose: () => void;
  onSaved: (customer: CustomerView) => void;
}) {
  return (
    <Dialog open={open} onClose={onClose} title={customer?.company ?? 'New customer'} size="lg">
      {open ? <CustomerForm customer={customer} onSaved={onSaved} onCancel={onClose} /> : null}
    </Dialog>
  );
}
