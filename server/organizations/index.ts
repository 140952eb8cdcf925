/** Organizations' surface for other components: the firm's settings as each request reads them. */
import { Organization } from './organization.entity';

export const organizationEntities = [Organization];
export { DEFAULT_TURNAROUND_DAYS, loadOrgContext, voiceOf, type OrgContext } from './org-context';
