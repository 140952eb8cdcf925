/** How an item looked when it was handed over or brought back. */
export type ItemCondition = 'good' | 'worn' | 'damaged';

/** One ticked line of the packing list walked at checkout or return (stored on the booking, shown on the handover sheet). */
export type ChecklistLine = { assetId: string; present: boolean; condition: ItemCondition; note?: string };
