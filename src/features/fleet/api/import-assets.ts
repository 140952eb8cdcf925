import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiUrl, uploadFile } from '../../../lib/api-client';
import { fleetKeys } from './keys';
import type { AssetImportResult } from '../../../../shared/assets/views';

export interface ImportAssetsInput {
  file: File;
  /** `preview` checks the file and writes nothing; `commit` writes every row or, on any error, none. */
  mode: 'preview' | 'commit';
  onProgress?: (fraction: number) => void;
}

/** POST /api/assets/import?mode=… with the raw CSV as the body, reporting upload progress. */
export function importAssets({ file, mode, onProgress }: ImportAssetsInput): Promise<AssetImportResult> {
  return uploadFile<AssetImportResult>('/assets/import', file, { query: { mode }, contentType: 'text/csv', onProgress });
}

/** The columns explained: a header row and two example rows. */
export const importTemplateUrl = () => apiUrl('/assets/import/template.csv');

export function useImportAssets() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importAssets,
    onSuccess: (result) => {
      if (result.mode === 'commit') return queryClient.invalidateQueries({ queryKey: fleetKeys.all });
    },
  });
}
