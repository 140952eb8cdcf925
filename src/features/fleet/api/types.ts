import type { AssetStatus, AssetType, AssetView } from '../../../lib/assets';
import type { CalibrationState } from '../../../lib/calibration';

export type { AssetView } from '../../../lib/assets';

/** The fleet list's filters (the filter bar; also the CSV export's). */
export interface AssetFilter {
  q?: string;
  type?: AssetType[];
  status?: AssetStatus[];
  calibration?: CalibrationState[];
  /** A kit's id, or `none` for assets in no kit. */
  kitId?: string;
}

export interface AssetListParams extends AssetFilter {
  /** A sort field, `-` first for descending (e.g. `-dueOn`). */
  sort?: string;
  limit: number;
  offset: number;
}

export interface AssetPage {
  items: AssetView[];
  total: number;
}

export interface AssetHistoryEntry {
  at: string;
  source: 'audit' | 'custody';
  action: string;
  actorName: string | null;
  summary: string;
  details: unknown;
}

export interface EquipmentRecordItem {
  clause: string;
  requirement: string;
  value: string | null;
  note?: string;
}

export interface EquipmentRecord {
  asset: AssetView;
  organization: { name: string };
  items: EquipmentRecordItem[];
  generatedAt: string;
}

export interface CalibrationPlanInput {
  required: boolean;
  intervalMonths?: number | null;
  provider?: string | null;
  lastCalibratedOn?: string | null;
}

export interface AssetInput {
  assetTag: string;
  serialNumber: string;
  manufacturer?: string | null;
  model?: string | null;
  firmwareVersion?: string | null;
  rfidTag?: string | null;
  location?: string | null;
  replacementValueMinor?: number | null;
  notes?: string | null;
  calibration?: CalibrationPlanInput;
  specs?: Record<string, unknown>;
}

export interface CreateAssetInput extends AssetInput {
  type: AssetType;
}

export interface ImportProblem {
  /** 1-based data row (the header is not counted). */
  row: number;
  column: string;
  message: string;
}

export interface ImportPreviewRow {
  row: number;
  type: string;
  assetTag: string;
  serialNumber: string;
  manufacturer: string | null;
  model: string | null;
  kit: string | null;
}

export interface ImportResult {
  mode: 'preview' | 'commit';
  rowCount: number;
  valid: boolean;
  errors: ImportProblem[];
  preview: ImportPreviewRow[];
  created: number;
}
