/** The asset vocabulary without zod, so the browser can use it without the schema library. */
/** DESIGN.md §3 "Asset". Names are the project's own; keep them. */
export const assetTypes = [
  'tracker',
  'controller',
  'probe',
  'tip',
  'battery',
  'smr',
  'reference_sphere',
  'nest',
  'scale_bar',
  'weather_station',
  'case',
  'accessory',
] as const;
export type AssetType = (typeof assetTypes)[number];

export const assetTypeTitles: Record<AssetType, string> = {
  tracker: 'Laser tracker',
  controller: 'Controller',
  probe: '6DoF probe',
  tip: 'Probe tip',
  battery: 'Battery',
  smr: 'SMR',
  reference_sphere: 'Reference sphere',
  nest: 'Nest',
  scale_bar: 'Scale bar',
  weather_station: 'Weather station',
  case: 'Case',
  accessory: 'Accessory',
};

/** Types that carry firmware (DESIGN.md §3). */
export const typesWithFirmware: readonly AssetType[] = ['tracker', 'controller', 'probe'];

export const assetStatuses = ['ready', 'out', 'at_lab', 'held', 'retired'] as const;
export type AssetStatus = (typeof assetStatuses)[number];

export const tipPositions = ['vertical', 'horizontal'] as const;
export type TipPosition = (typeof tipPositions)[number];

export const assetSortFields = ['assetTag', 'type', 'serialNumber', 'manufacturer', 'model', 'location', 'status', 'dueOn', 'updatedAt'] as const;
