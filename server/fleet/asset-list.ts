import { searchKey } from '../../shared/assets/search-key';
import type { AssetSuggestion } from '../../shared/assets/views';
import { addDays } from '../../shared/calibration/due-date';
import type { AssetListQuery } from '../../shared/schemas/assets';
import type { Scoped } from '../db/scoped';
import type { OrgContext } from '../organizations';
import type { Asset } from './asset.entity';

const sortColumns: Record<string, string> = {
  assetTag: 'a.asset_tag',
  type: 'a.type',
  serialNumber: 'a.serial_number',
  manufacturer: 'a.manufacturer',
  model: 'a.model',
  location: 'a.location',
  status: 'a.status',
  dueOn: 'a.due_on',
  updatedAt: 'a.updated_at',
};

/** Calibration states as SQL over the stored due date, given today and the end of the due-soon window. */
type Placeholder = () => string;
const stateConditions: Record<string, (today: Placeholder, soonEnd: Placeholder) => string> = {
  not_required: () => 'a.calibration_required = false',
  overdue: (today) => `a.calibration_required AND (a.due_on IS NULL OR a.due_on < ${today()})`,
  due_soon: (today, soonEnd) => `a.calibration_required AND a.due_on >= ${today()} AND a.due_on <= ${soonEnd()}`,
  current: (_today, soonEnd) => `a.calibration_required AND a.due_on > ${soonEnd()}`,
};

const COLUMNS = `a.id, a.organization_id AS "organizationId", a.type, a.asset_tag AS "assetTag", a.serial_number AS "serialNumber",
  a.manufacturer, a.model, a.firmware_version AS "firmwareVersion", a.rfid_tag AS "rfidTag", a.location,
  a.replacement_value_minor::float8 AS "replacementValueMinor", a.notes, a.status, a.specs, a.tolerance_overrides AS "toleranceOverrides", a.kit_id AS "kitId",
  a.calibration_required AS "calibrationRequired", a.calibration_interval_months AS "calibrationIntervalMonths",
  a.calibration_provider AS "calibrationProvider", to_char(a.last_calibrated_on, 'YYYY-MM-DD') AS "lastCalibratedOn",
  to_char(a.due_on, 'YYYY-MM-DD') AS "dueOn", a.retired_at AS "retiredAt", a.retired_reason AS "retiredReason",
  a.created_at AS "createdAt", a.updated_at AS "updatedAt", k.name AS "kitName"`;

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

type Row = Asset & { kitName: string | null };
const toAsset = ({ kitName, ...row }: Row): Asset =>
  Object.assign(row, { kit: row.kitId ? ({ id: row.kitId, name: kitName } as Asset['kit']) : null }) as Asset;

/**
 * The filtered, sorted asset list (one page and the total), shared by the list, the CSV export and the home pages. Plain SQL
 * because this is the fleet page's hot path: with 20,000 assets it must answer
 * in a few milliseconds.
 */
export async function findAssets(tx: Scoped, ctx: OrgContext, filter: Omit<AssetListQuery, 'limit' | 'offset'>, page?: { limit: number; offset: number }) {
  const params: unknown[] = [];
  const where = ['a.organization_id = $1'];
  const param = (v: unknown) => `$${params.push(v) + 1}`;
  // search_text is kept lower-cased by a trigger and trigram-indexed (FleetSearchColumn migration).
  // search_key holds tags, serials and RFID tags in their forgiving form ("tip 5" finds TIP-005; an RFID tag without separators, by its tail).
  if (filter.q) {
    const key = searchKey(filter.q);
    const text = `a.search_text LIKE ${param(`%${escapeLike(filter.q.toLowerCase())}%`)}`;
    where.push(key ? `(${text} OR a.search_key LIKE ${param(`%${key}%`)})` : text);
  }
  if (filter.type?.length) where.push(`a.type = ANY(${param(filter.type)})`);
  if (filter.status?.length) where.push(`a.status = ANY(${param(filter.status)})`);
  if (filter.calibration?.length) {
    // Bound only when a condition uses it: PostgreSQL refuses parameters it cannot type.
    const once = (value: string): Placeholder => {
      let placeholder: string | undefined;
      return () => (placeholder ??= `${param(value)}::date`);
    };
    const [today, soonEnd] = [once(ctx.today), once(addDays(ctx.today, ctx.dueSoonDays))];
    where.push(`(${filter.calibration.map((s) => `(${stateConditions[s](today, soonEnd)})`).join(' OR ')})`);
  }
  if (filter.kitId === 'none') where.push('a.kit_id IS NULL');
  else if (filter.kitId) where.push(`a.kit_id = ${param(filter.kitId)}`);
  const sort = filter.sort ?? 'assetTag';
  const column = sortColumns[sort.replace(/^-/, '')];
  const order = `${column} ${sort.startsWith('-') ? 'DESC' : 'ASC'} NULLS LAST${column === 'a.asset_tag' ? '' : ', a.asset_tag'}`;
  const limit = page ? ` LIMIT ${page.limit} OFFSET ${page.offset}` : '';
  const filters = where.join(' AND ');
  if (where.length > 1 && page) {
    // Filtered: gather the matches once (through whichever indexes fit the filters), then count and
    // sort them. Walking the tag index in order and testing every row can cost far more.
    const rows = await tx.sql<Row & { total: string }>(
      `WITH hits AS MATERIALIZED (SELECT a.* FROM assets a WHERE ${filters})
       SELECT ${COLUMNS}, (SELECT count(*) FROM hits) AS total FROM hits a LEFT JOIN kits k ON k.id = a.kit_id ORDER BY ${order}${limit}`,
      params,
    );
    const total = rows.length
      ? Number(rows[0].total)
      : Number((await tx.sql<{ n: string }>(`SELECT count(*) AS n FROM assets a WHERE ${filters}`, params))[0].n);
    return { assets: rows.map(({ total: _total, ...row }) => toAsset(row as Row)), total };
  }
  // Unfiltered: the page straight off the sort index, and the total from the organization index.
  const [rows, [{ total }]] = await Promise.all([
    tx.sql<Row>(`SELECT ${COLUMNS} FROM assets a LEFT JOIN kits k ON k.id = a.kit_id WHERE ${filters} ORDER BY ${order}${limit}`, params),
    page ? tx.sql<{ total: string }>(`SELECT count(*) AS total FROM assets a WHERE ${filters}`, params) : Promise.resolve([{ total: '-1' }]),
  ]);
  return { assets: rows.map(toAsset), total: page ? Number(total) : rows.length };
}

/**
 * Near misses of a forgiving search key: the assets whose tag, serial or RFID tag looks most like it by trigram
 * word similarity (pg_trgm), best first. Offered when a search or a label look-up finds nothing.
 */
export async function nearMisses(tx: Scoped, key: string): Promise<AssetSuggestion[]> {
  if (key.length < 2) return [];
  // A looser bar than pg_trgm's default 0.6 for `<%`: tags are short, so one wrong character costs several trigrams. Local to this transaction.
  await tx.manager.query(`SELECT set_config('pg_trgm.word_similarity_threshold', '0.3', true)`);
  return tx.sql<AssetSuggestion>(
    `SELECT a.id, a.asset_tag AS "assetTag", a.type, a.model
       FROM assets a
      WHERE a.organization_id = $1 AND a.status <> 'retired' AND $2 <% a.search_key
      ORDER BY word_similarity($2, a.search_key) DESC, a.asset_tag
      LIMIT 5`,
    [key],
  );
}
