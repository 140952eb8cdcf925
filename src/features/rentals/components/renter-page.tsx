import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import type { RenterItem, RenterRentalView } from '../../../../shared/billing/views';
import { buttonClasses, Button } from '../../../components/button';
import { CheckboxField, Field } from '../../../components/field';
import { DownloadIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import { FactList, Panel } from '../../../components/panel';
import { StatusChip } from '../../../components/status-chip';
import { assetTypeTitles, type AssetType } from '../../../lib/assets';
import { isApiError } from '../../../lib/api-client';
import { formatCalendarDate, formatDateTime, formatMoney, useFirmFormat } from '../../../lib/format';
import { useAcceptAgreement } from '../api/accept-agreement';
import { renterDocumentUrl } from '../api/get-renter-rental';
import { QuoteLines } from './quote-lines';
import { RenterCautions } from './rental-items';

/** Where the renter's page keeps its own address while the renter is at the provider's page (the provider sends them back to /renter/returned). */
export const RENTER_TOKEN_KEY = 'nestkeeper.renter-link';

function Calibration({ item, endsOn }: { item: RenterItem; endsOn: string }) {
  if (!item.calibrationRequired) return <StatusChip tone="none" label="No calibration needed" />;
  if (item.coversRental) return <StatusChip tone="ok" label={`Valid through ${formatCalendarDate(item.validThrough)}`} />;
  return (
    <StatusChip
      tone="warn"
      label={item.validThrough ? `Due ${formatCalendarDate(item.validThrough)}, before ${formatCalendarDate(endsOn)}` : 'No calibration on record'}
    />
  );
}

function Items({ view, token }: { view: RenterRentalView; token: string }) {
  return (
    <Panel title={`Items and calibration (${view.items.length})`}>
      <ul className="divide-y divide-paper-line">
        {view.items.map((item) => (
          <li key={item.assetTag} className="flex flex-col gap-1 py-2 sm:flex-row sm:items-center sm:justify-between">
            <div className="min-w-0">
              <span className="font-mono font-semibold">{item.assetTag}</span> · {assetTypeTitles[item.type as AssetType] ?? item.type}
              <div className="text-sm text-ink-700">
                {[item.manufacturer, item.model].filter(Boolean).join(' ') || 'Model not recorded'} · serial{' '}
                <span className="font-mono">{item.serialNumber}</span>
              </div>
            </div>
            <div className="self-start sm:self-auto">
              <Calibration item={item} endsOn={view.endsOn} />
            </div>
          </li>
        ))}
      </ul>
      <p className="mt-2 text-sm text-ink-700">
        Each date is the last day the item’s calibration is valid; your rental ends {formatCalendarDate(view.endsOn)}.
      </p>
      <a href={renterDocumentUrl(token, 'certificate-pack')} className={`${buttonClasses('secondary', 'sm')} mt-2`}>
        <DownloadIcon size={14} />
        Certificate pack (PDF)
      </a>
    </Panel>
  );
}

function Agreement({ view, token }: { view: RenterRentalView; token: string }) {
  const accept = useAcceptAgreement();
  const [problem, setProblem] = useState<string>();
  const accepted = view.agreement.accepted;
  return (
    <Panel title="1. Rental agreement">
      <ul className="mb-3 list-disc space-y-1 pl-5 text-sm text-ink-800">
        {view.terms.map((term) => (
          <li key={term}>{term}</li>
        ))}
      </ul>
      <a href={renterDocumentUrl(token, 'agreement')} className={buttonClasses('secondary', 'sm')}>
        <DownloadIcon size={14} />
        Rental agreement (PDF)
      </a>
      <p className="mt-2 break-all text-xs text-ink-500">
        SHA-256 of this agreement: <span className="font-mono">{view.agreement.sha256}</span>
      </p>
      {accepted ? (
        <Notice tone="success" title="Agreement accepted" className="mt-3">
          Accepted by {accepted.fullName} on {formatDateTime(accepted.acceptedAt)}.
        </Notice>
      ) : (
        <Formik
          initialValues={{ fullName: '', agreed: false }}
          validationSchema={Yup.object({
            fullName: Yup.string()
              .trim()
              .required('Type your full name.')
              .matches(/\p{L}.*\s+.*\p{L}/u, 'Type your first and last name.'),
            agreed: Yup.boolean().oneOf([true], 'Tick the box to accept the agreement.'),
          })}
          onSubmit={async (values, helpers) => {
            setProblem(undefined);
            try {
              await accept.mutateAsync({ token, fullName: values.fullName.trim(), agreed: values.agreed, agreementSha256: view.agreement.sha256 });
            } catch (error) {
              if (isApiError(error) && Object.keys(error.fieldErrors).some((f) => f === 'fullName' || f === 'agreed')) helpers.setErrors(error.fieldErrors);
              else setProblem(error instanceof Error ? error.message : 'The acceptance was not recorded. Try again.');
            }
          }}
        >
          {({ isSubmitting }) => (
            <Form noValidate className="mt-3 flex flex-col gap-3" aria-label="Accept the rental agreement">
              {problem ? (
                <Notice tone="error" title="Not accepted yet">
                  {problem}
                </Notice>
              ) : null}
              <Field name="fullName" label="Your full name" autoComplete="name" />
              <CheckboxField name="agreed" label={`I have read the rental agreement and accept it for ${view.customer.company}.`} />
              <div>
                <Button type="submit" variant="primary" busy={isSubmitting}>
                  Accept the agreement
                </Button>
              </div>
            </Form>
          )}
        </Formik>
      )}
    </Panel>
  );
}

function Deposit({ view, token }: { view: RenterRentalView; token: string }) {
  const { state, request, card } = view.deposit;
  const amount = formatMoney(view.depositMinor, view.currency);
  const leave = () => sessionStorage.setItem(RENTER_TOKEN_KEY, token);
  return (
    <Panel title="2. Deposit">
      <p className="mb-3 text-sm text-ink-800">
        {amount} is authorized on your card, not charged. What is not needed for damage or late days is released when the kit is back.
      </p>
      {state === 'authorized' ? (
        <Notice tone="success" title="Deposit authorized">
          {card ?? 'Your card'} is authorized for {amount}. Nothing is charged now.
        </Notice>
      ) : request && (request.state === 'waiting' || request.state === 'declined') && request.url ? (
        <div className="flex flex-col gap-3">
          {request.state === 'declined' ? (
            <Notice tone="error" title="Your card was declined">
              {request.declineMessage} Try another card on the same page.
            </Notice>
          ) : null}
          <div>
            <a href={request.url} onClick={leave} className={buttonClasses('primary')}>
              Place the deposit on your card
            </a>
          </div>
          <p className="text-sm text-ink-700">
            You type the card on the payment provider’s own page; {view.firm.name} never sees its number. The page is open until{' '}
            {formatDateTime(request.expiresAt)}.
          </p>
        </div>
      ) : (
        <Notice tone="caution" title="The payment link has expired">
          Ask {view.firm.name} to send you a new link.
        </Notice>
      )}
    </Panel>
  );
}

/** The renter's own page: the rental, its price and terms, the agreement to accept, the items' calibration, the deposit. */
export function RenterPage({ view, token }: { view: RenterRentalView; token: string }) {
  const { dateRange } = useFirmFormat();
  return (
    <div className="flex flex-col gap-4">
      <Panel title="Your rental">
        <FactList
          items={[
            { term: 'Rental', value: view.number, mono: true },
            { term: 'For', value: `${view.customer.company}${view.customer.billingContact ? `, ${view.customer.billingContact}` : ''}` },
            { term: 'Dates', value: `${dateRange(view.startsOn, view.endsOn)} (${view.quote.days} days, both included)` },
            { term: 'Deposit', value: formatMoney(view.depositMinor, view.currency) },
          ]}
        />
      </Panel>
      <Panel title="Price">
        <QuoteLines quote={view.quote} />
      </Panel>
      <Items view={view} token={token} />
      <RenterCautions items={view.items} />
      <Agreement view={view} token={token} />
      <Deposit view={view} token={token} />
      <p className="text-xs text-ink-500">This page opens without sign-in until {formatDateTime(view.linkExpiresAt)}. Keep the link to yourself.</p>
    </div>
  );
}
