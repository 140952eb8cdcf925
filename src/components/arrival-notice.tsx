import { useLocation } from 'react-router-dom';
import { Notice } from './notice';

/** The success words a screen was sent here with (`navigate(to, { state: { notice } })`), e.g. right after creating the record. */
export function ArrivalNotice() {
  const notice = (useLocation().state as { notice?: string } | null)?.notice;
  if (!notice) return null;
  return (
    <Notice tone="success" className="mb-4">
      {notice}
    </Notice>
  );
}
