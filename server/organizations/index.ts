/** Organizations' surface for other components: the firm's settings as each request reads them. */
import { Organization } from './organization.entity';

export const organizationEntities = [Organization];
export { DEFAULT_TURNAROUND_DAYS, loadOrgContext, type OrgContext } from './org-context';
export { documentFirm, formatOf, loadFirmFormat, voiceOf } from './org-context';
