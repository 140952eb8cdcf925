/** A customer site job of the firm's own (DESIGN.md §3 "Job"). */
export interface SiteJob {
  id: string;
  reference: string;
  customerName: string;
  contactName: string | null;
  contactEmail: string | null;
  siteAddress: string | null;
  startsOn: string;
  endsOn: string;
  leadTechnicianId: string | null;
  notes: string | null;
}

export interface SiteJobPage {
  items: SiteJob[];
  total: number;
}

export type SiteJobInput = Omit<SiteJob, 'id'>;
