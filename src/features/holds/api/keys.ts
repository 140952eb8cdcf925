import { holdsQueryRoot } from '../../../lib/asset-status';

export const holdsKeys = {
  all: holdsQueryRoot,
  forAsset: (assetId: string) => [...holdsKeys.all, 'asset', assetId] as const,
};
