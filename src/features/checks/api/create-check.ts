import { useMutation, useQueryClient } from '@tanstack/react-query';
import { csrfToken } from '../../../lib/api-client';
import { invalidateAssetStatus } from '../../../lib/asset-status';
import { queueFieldRecord, type QueueOutcome } from '../../../lib/field/outbox';
import { checksKeys } from './keys';
import type { CheckPayload } from '../../../../shared/schemas/checks';
import type { CheckView } from '../../../../shared/checks/views';

export type RecordCheckInput = {
  /** Made on the phone with the form: the check's id and its idempotency key. */
  payload: CheckPayload & { id: string };
  userId: string;
  title: string;
  /** The form's values, to open it again if the server refuses the check. */
  draft: unknown;
};

export type RecordCheckOutcome = { state: 'sent'; check: CheckView } | { state: 'waiting' };

/** POST /api/checks through the phone's outbox: saved on the phone first, sent now if there is signal, later if not. */
export async function recordCheck(input: RecordCheckInput): Promise<RecordCheckOutcome> {
  const outcome: QueueOutcome = await queueFieldRecord(
    {
      id: input.payload.id,
      userId: input.userId,
      title: input.title,
      assetId: input.payload.assetId,
      request: { kind: 'check', payload: input.payload },
      draft: input.draft,
    },
    csrfToken,
  );
  return outcome.state === 'sent' ? { state: 'sent', check: outcome.reply as CheckView } : outcome;
}

/** A failing check holds the item at once, so the fleet, kits and holds read again too. Runs without signal as well. */
export function useCreateCheck() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordCheck,
    networkMode: 'always',
    onSuccess: (outcome) => {
      if (outcome.state !== 'sent') return;
      queryClient.setQueryData(checksKeys.one(outcome.check.id), outcome.check);
      return Promise.all([queryClient.invalidateQueries({ queryKey: checksKeys.all }), invalidateAssetStatus(queryClient)]);
    },
  });
}
