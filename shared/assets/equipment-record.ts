/** One entry of an item's equipment record (ISO/IEC 17025:2017 §6.4.13 a)–h)): what Nestkeeper holds for it. */
export type EquipmentRecordItem = { clause: string; requirement: string; value: string | null; note?: string };
