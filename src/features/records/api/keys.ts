import type { AuditPackScope } from '../../../../shared/schemas/records';

/** The audit pack's choices: a period (both days included) and which items. */
export interface AuditPackChoice {
  from: string;
  to: string;
  scope: AuditPackScope;
  kitId?: string;
  type?: string;
}

export const recordsKeys = {
  all: ['records'] as const,
  packPreview: (choice: AuditPackChoice) => [...recordsKeys.all, 'pack-preview', choice] as const,
};
