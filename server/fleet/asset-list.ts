import { addDays } from '../../shared/calibration/due-date';
import type { AssetListQuery } from '../../shared/schemas/assets';
import type { Scoped } from '../db/scoped';
import type { OrgContext } from '../organizations/org-context';
import { Asset } from './asset.entity';

/** The same text the trigram index covers (see the FleetRegister migration). */
const SEARCH_TEXT = `(a.asset_tag || ' ' || a.serial_number || ' ' || coalesce(a.rfid_tag, '') || ' ' || coalesce(a.manufacturer, '') || ' ' || coalesce(a.model, '') || ' ' || coalesce(a.location, ''))`;

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

/** Calibration states as SQL over the stored due date, with the organization's today and window. */
const stateConditions: Record<string, string> = {
  not_required: 'a.calibration_required = false',
  overdue: 'a.calibration_required AND (a.due_on IS NULL OR a.due_on < :today)',
  due_soon: 'a.calibration_required AND a.due_on >= :today AND a.due_on <= :soonEnd',
  current: 'a.calibration_required AND a.due_on > :soonEnd',
};

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/** The filtered, sorted asset query shared by the list, the CSV export and the home pages. */
export function filteredAssets(tx: Scoped, ctx: OrgContext, filter: Omit<AssetListQuery, 'limit' | 'offset'>) {
  const qb = tx.select(Asset, 'a').leftJoinAndSelect('a.kit', 'k');
  if (filter.q) qb.andWhere(`${SEARCH_TEXT} ILIKE :q`, { q: `%${escapeLike(filter.q)}%` });
  if (filter.type?.length) qb.andWhere('a.type IN (:...types)', { types: filter.type });
  if (filter.status?.length) qb.andWhere('a.status IN (:...statuses)', { statuses: filter.status });
  if (filter.calibration?.length) {
    qb.andWhere(`(${filter.calibration.map((s) => `(${stateConditions[s]})`).join(' OR ')})`, {
      today: ctx.today,
      soonEnd: addDays(ctx.today, ctx.dueSoonDays),
    });
  }
  if (filter.kitId === 'none') qb.andWhere('a.kit_id IS NULL');
  else if (filter.kitId) qb.andWhere('a.kit_id = :kitId', { kitId: filter.kitId });
  const sort = filter.sort ?? 'assetTag';
  const descending = sort.startsWith('-');
  qb.orderBy(sortColumns[sort.replace(/^-/, '')], descending ? 'DESC' : 'ASC', 'NULLS LAST');
  if (sort.replace(/^-/, '') !== 'assetTag') qb.addOrderBy('a.asset_tag', 'ASC');
  return qb;
}
