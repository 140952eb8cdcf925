import { assetTypeTitles, type AssetType } from './vocabulary';

/** A type's name inside a sentence: "laser tracker", but "SMR" and "6DoF probe" keep their capitals. */
export function typeInSentence(type: string): string {
  const title = assetTypeTitles[type as AssetType] ?? 'item';
  return /^[A-Z][a-z]/.test(title) ? title[0].toLowerCase() + title.slice(1) : title;
}

/** An item as a letter names it: "the laser tracker TRK-004, serial LT-88213" — never a bare tag. */
export const itemInWords = (item: { type: string; assetTag: string; serialNumber?: string | null }) =>
  `the ${typeInSentence(item.type)} ${item.assetTag}${item.serialNumber ? `, serial ${item.serialNumber}` : ''}`;
