import type { AssetView, KitView } from '../../../lib/assets';

export type { AssetView, KitReadiness, KitView } from '../../../lib/assets';

export interface KitPage {
  items: KitView[];
  total: number;
}

export type KitWithMembers = KitView & { members: AssetView[] };

export interface KitInput {
  name: string;
  notes?: string | null;
  memberIds?: string[];
}

/** 409 `conflict` from PATCH/POST: assets already in another kit. */
export interface KitMemberConflict {
  assetId: string;
  assetTag: string;
  kitId: string;
  kitName: string;
}

export interface ShippingSheetLine {
  assetId: string;
  assetTag: string;
  nominalVoltageV: number;
  ratedCapacityAh: number;
  wattHours: number;
  damaged: boolean;
  class: import('../../../lib/batteries').ShippingClass;
}

export interface ShippingSheet {
  kit: { id: string; name: string };
  lines: ShippingSheetLine[];
  totalWattHours: number;
  strictest: import('../../../lib/batteries').ShippingClass | null;
  count: number;
}
