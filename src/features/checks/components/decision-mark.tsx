import { CheckIcon, CrossIcon } from '../../../components/icons';
import type { Decision } from '../../../lib/checks';

const words: Record<Decision, string> = { pass: 'Pass', fail: 'Fail' };

/** A decision as a word plus a mark (✓ / ✗ and a hatch on fail), never colour alone. */
export function DecisionMark({ decision, size = 'md' }: { decision: Decision; size?: 'md' | 'lg' }) {
  const pass = decision === 'pass';
  const large = size === 'lg';
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-md border font-bold whitespace-nowrap ${
        large ? 'px-3 py-1 text-2xl' : 'px-2 py-px text-sm'
      } ${pass ? 'border-ok/50 bg-ok-wash text-ok' : 'nk-hatch border-bad/60 bg-bad-wash text-bad'}`}
    >
      {pass ? <CheckIcon size={large ? 24 : 14} /> : <CrossIcon size={large ? 24 : 14} />}
      <span className="text-ink-900">{words[decision]}</span>
    </span>
  );
}
