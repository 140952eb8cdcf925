/** Organizations' surface for other components: the firm's settings as each request reads them. */
export { DEFAULT_TURNAROUND_DAYS, loadOrgContext, type OrgContext } from './org-context';
