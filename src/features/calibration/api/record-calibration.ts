import { useMutation, useQueryClient } from '@tanstack/react-query';
import { uploadForm } from '../../../lib/api-client';
import { invalidateAssetStatus, invalidateBookingBoard } from '../../../lib/asset-status';
import { calibrationKeys } from './keys';
import type { AsFound } from '../../../../shared/calibration/interval-review';
import type { CalibrationEventView } from '../../../../shared/calibration/views';

/** Multipart: the text fields, then the certificate PDF under "certificate"; progress 0…1 as it goes up. */
export interface RecordCalibrationInput {
  assetId: string;
  performedOn: string;
  provider: string;
  certificateNumber: string;
  asFound: AsFound;
  /** The largest as-found error the certificate states (µm), if it states one. */
  asFoundErrorUm?: number;
  asLeft: AsFound;
  intervalMonths?: number;
  note?: string;
  certificate: File;
}

export function recordCalibration(input: RecordCalibrationInput, onProgress?: (fraction: number) => void): Promise<CalibrationEventView> {
  const form = new FormData();
  form.set('performedOn', input.performedOn);
  form.set('provider', input.provider);
  form.set('certificateNumber', input.certificateNumber);
  form.set('asFound', input.asFound);
  if (input.asFoundErrorUm !== undefined) form.set('asFoundErrorUm', String(input.asFoundErrorUm));
  form.set('asLeft', input.asLeft);
  if (input.intervalMonths !== undefined) form.set('intervalMonths', String(input.intervalMonths));
  if (input.note) form.set('note', input.note);
  form.set('certificate', input.certificate, input.certificate.name);
  return uploadForm<CalibrationEventView>(`/assets/${encodeURIComponent(input.assetId)}/calibrations`, form, { onProgress });
}

/**
 * Recording moves the due date, brings an item back from the lab (closing its
 * lab booking), may release a hold and may open an impact review: the asset's
 * status, the board and every calibration read change.
 */
export function useRecordCalibration(onProgress?: (fraction: number) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: RecordCalibrationInput) => recordCalibration(input, onProgress),
    onSuccess: () =>
      Promise.all([queryClient.invalidateQueries({ queryKey: calibrationKeys.all }), invalidateAssetStatus(queryClient), invalidateBookingBoard(queryClient)]),
  });
}
