export interface OrganizationSettings {
  /** Days before the due date an item counts as "due soon". */
  dueSoonDays: number;
  timeZone: string;
  currency: string;
  name: string;
}
