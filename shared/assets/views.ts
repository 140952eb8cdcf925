/**
 * What the fleet and kits API answers. Plain types, no zod: the browser
 * imports them as types only.
 */
import type { BatteryForShipping, ShippingClass } from '../batteries/shipping-class';
import type { CalibrationState } from '../calibration/due-date';
import type { AssetStatus, AssetType } from './vocabulary';

/** An asset as the API returns it. */
export type AssetView = {
  id: string;
  type: AssetType;
  assetTag: string;
  serialNumber: string;
  manufacturer: string | null;
  model: string | null;
  firmwareVersion: string | null;
  rfidTag: string | null;
  location: string | null;
  replacementValueMinor: number | null;
  currency: string;
  notes: string | null;
  status: AssetStatus;
  specs: Record<string, unknown>;
  kit: { id: string; name: string } | null;
  calibration: {
    required: boolean;
    intervalMonths: number | null;
    provider: string | null;
    lastCalibratedOn: string | null;
    dueOn: string | null;
    state: CalibrationState;
  };
  toleranceOverrides: Record<string, unknown> | null;
  /** What the QR label encodes; `GET /api/assets/lookup?code=` resolves it. */
  qrPayload: string;
  retiredAt: string | null;
  retiredReason: string | null;
  createdAt: string;
  updatedAt: string;
};

/** `GET /api/assets/:id/history`: the audit trail and the chain of custody together, newest first. */
export type AssetHistoryEntry = {
  at: string;
  source: 'audit' | 'custody';
  action: string;
  actorName: string | null;
  summary: string;
  details: Record<string, unknown>;
};

/** One entry of the equipment record (ISO/IEC 17025:2017 §6.4.13 a)–h)). */
export type EquipmentRecordItem = { clause: string; requirement: string; value: string | null; note?: string };

/** A problem in an import file; `row` counts data rows from 1 (the header is not counted). */
export type ImportProblem = { row: number; column: string; message: string };

/** `POST /api/assets/import`: `preview` checks and writes nothing, `commit` writes every row or none. */
export type AssetImportResult = {
  mode: 'preview' | 'commit';
  rowCount: number;
  valid: boolean;
  /** The first problems, by row; `errorCount` says how many there are in all. */
  errors: ImportProblem[];
  errorCount: number;
  /** The first rows as they would be registered. */
  preview: {
    row: number;
    kit: string | null;
    type: AssetType;
    assetTag: string;
    serialNumber: string;
    manufacturer?: string | null;
    model?: string | null;
  }[];
  created: number;
};

export type KitReadiness = { ready: boolean; reasons: { assetId: string; assetTag: string; reason: 'not_ready' | 'calibration_overdue' }[] };

export type KitView = {
  id: string;
  name: string;
  notes: string | null;
  memberCount: number;
  readiness: KitReadiness;
  createdAt: string;
  updatedAt: string;
};

/** A single kit (`GET /api/kits/:id`, and the answer to creating or changing one) with its packing list. */
export type KitWithMembersView = KitView & { members: AssetView[] };

/** `details.conflicts` of a 409 when a kit would take assets already in another kit. */
export type KitMemberConflict = { assetId: string; assetTag: string; kitId: string; kitName: string };

/** `GET /api/kits/:id/shipping-sheet`: the kit's lithium batteries with their watt-hours and shipping class. */
export type ShippingSheetView = {
  kit: { id: string; name: string };
  lines: (BatteryForShipping & { assetId: string; wattHours: number; class: ShippingClass })[];
  totalWattHours: number;
  strictest: ShippingClass | null;
  count: number;
};

/** A near miss offered when a search or a label look-up finds nothing (`GET /api/assets/suggestions`, and `details.suggestions` of the look-up's 404). */
export type AssetSuggestion = { id: string; assetTag: string; type: AssetType; model: string | null };
