import { formatNumber } from '../../../lib/format';
import type { DecisionRule } from '../../../lib/checks';
import { decisionRuleWords, um } from './check-words';
import type { Preview } from './check-values';
import { DecisionMark } from './decision-mark';

function Row({ term, value, strong = false }: { term: string; value: string; strong?: boolean }) {
  return (
    <div className="flex items-baseline justify-between gap-3 border-b border-paper-line/70 py-1 last:border-0">
      <dt className="text-sm text-ink-700">{term}</dt>
      <dd className={`font-mono text-[0.95rem] ${strong ? 'font-semibold text-ink-900' : 'text-ink-900'}`}>{value}</dd>
    </div>
  );
}

/** The live preview: the numbers the server will store, and the decision it will reach. */
export function CheckPreview({ preview, rule }: { preview: Preview; rule: DecisionRule | null }) {
  const n = preview.numbers;
  return (
    <section aria-labelledby="check-preview-heading" aria-live="polite" className="rounded-lg border border-paper-line bg-card p-4">
      <div className="mb-2 flex items-center justify-between gap-2">
        <h2 id="check-preview-heading" className="text-lg font-bold">
          Preview
        </h2>
        {preview.decision ? <DecisionMark decision={preview.decision} size="lg" /> : <span className="text-sm text-ink-700">No decision yet</span>}
      </div>
      <dl>
        {n?.kind === 'tip_validation' ? (
          <>
            {n.deviationsUm.map((d, i) => (
              <Row key={i} term={`Reading ${i + 1}: distance from R`} value={d === null ? '—' : um(d)} />
            ))}
            <Row term="Mean point's offset from R" value={um(n.meanOffsetUm)} />
            <Row term="Spread (largest distance from the mean)" value={um(n.spreadUm)} />
            <Row term="Largest deviation (judged)" value={um(n.maxDeviationUm)} strong />
          </>
        ) : null}
        {n?.kind === 'two_face' ? <Row term="Two-face error (judged)" value={um(n.errorUm)} strong /> : null}
        {n?.kind === 'length_check' ? (
          <>
            <Row term="Measured length" value={`${formatNumber(n.measuredMm, 4)} mm`} />
            <Row term="Expected length at this temperature" value={`${formatNumber(n.expectedMm, 4)} mm`} />
            <Row term="Error, measured − expected (judged)" value={um(n.errorUm)} strong />
          </>
        ) : null}
        <Row term="Tolerance" value={preview.toleranceUm === null ? '—' : um(preview.toleranceUm)} />
        <Row term="Expanded uncertainty U (k = 2)" value={um(preview.expandedUncertaintyUm)} />
        <Row term="Guard band" value={preview.guardBandUm === null ? '—' : um(preview.guardBandUm)} />
        <Row term="Acceptance limit" value={preview.acceptanceLimitUm === null ? '—' : um(preview.acceptanceLimitUm)} />
      </dl>
      {rule ? <p className="mt-2 text-sm text-ink-700">Decision rule: {decisionRuleWords[rule]}.</p> : null}
      {preview.waiting.length ? (
        <ul className="mt-2 list-disc pl-5 text-sm text-ink-700">
          {preview.waiting.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
