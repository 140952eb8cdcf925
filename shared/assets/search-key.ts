/**
 * The forgiving form of what someone types or a label carries: lower case, letters and digits only, digit runs
 * without leading zeros. "TIP-005", "tip 5", "TIP5" and "tip-005" all become "tip5"; "E2:80:11:45:104" becomes
 * "e2801145104". The database keeps tags, serials and RFID tags in this form (`nk_search_key`, FleetForgivingSearch
 * migration) and tests/api/fleet-search.test.ts proves the two spellings agree.
 */
export function searchKey(text: string): string {
  return text
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '')
    .replace(/(^|[a-z])0+(?=[0-9])/g, '$1');
}
