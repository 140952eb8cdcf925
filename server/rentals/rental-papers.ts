import type { RentalView } from '../../shared/billing/views';
import type { Scoped } from '../db/scoped';
import { certificatePackPdf, type CertificateEntry } from '../documents/certificate-pack';
import { rentalAgreementPdf } from '../documents/rental-agreement-pdf';
import { documentFirm, loadOrgContext } from '../organizations';

/** The rental agreement as a PDF. */
export async function agreementFor(tx: Scoped, rental: RentalView): Promise<Buffer> {
  const ctx = await loadOrgContext(tx);
  return rentalAgreementPdf({ firm: documentFirm(ctx), rental });
}

/**
 * One PDF with the current certificate of every rented item that needs
 * calibration, so the renter can show their own auditors the kit was in
 * calibration (the newest calibration event per item, with its stored file).
 */
export async function certificatePackFor(tx: Scoped, rental: RentalView): Promise<Buffer> {
  const ctx = await loadOrgContext(tx);
  const rows = await tx.sql<{
    asset_id: string;
    certificate_number: string | null;
    performed_on: string | null;
    due_on: string | null;
    provider: string | null;
    data: Buffer | null;
    calibration_required: boolean;
  }>(
    `SELECT a.id AS asset_id, a.calibration_required, ev.certificate_number, to_char(ev.performed_on, 'YYYY-MM-DD') AS performed_on,
            to_char(coalesce(ev.due_on, a.due_on), 'YYYY-MM-DD') AS due_on, ev.provider, f.data
       FROM assets a
       LEFT JOIN LATERAL (SELECT * FROM calibration_events e WHERE e.asset_id = a.id ORDER BY e.performed_on DESC, e.created_at DESC LIMIT 1) ev ON true
       LEFT JOIN certificate_files f ON f.id = ev.certificate_file_id
      WHERE a.organization_id = $1 AND a.id = ANY($2)`,
    [rental.items.map((i) => i.id)],
  );
  const entries: CertificateEntry[] = rental.items.flatMap((item) => {
    const row = rows.find((r) => r.asset_id === item.id);
    if (!row?.calibration_required) return [];
    return [
      {
        assetTag: item.assetTag,
        type: item.type,
        serialNumber: item.serialNumber,
        model: item.model,
        certificateNumber: row.certificate_number,
        performedOn: row.performed_on,
        dueOn: row.due_on,
        provider: row.provider,
        pdf: row.data,
      },
    ];
  });
  return certificatePackPdf({
    firm: documentFirm(ctx),
    rentalNumber: rental.number,
    customerCompany: rental.customer.company,
    startsOn: rental.startsOn,
    endsOn: rental.endsOn,
    entries,
  });
}
