import type { ReactNode } from 'react';
import { Notice } from '../../../components/notice';
import { FactList } from '../../../components/panel';
import { formatNumber, useFirmFormat } from '../../../lib/format';
import type { CheckView } from '../../../../shared/checks/views';
import { checkKindWords, decisionRuleWords, positionWords, toleranceText, um } from './check-words';
import { DecisionMark } from './decision-mark';
import { ReadingsSketch } from './readings-sketch';

/** A stored check: the server's own numbers and decision, word plus mark. */
export function CheckResult({ check, assetTag, heldNotice = true }: { check: CheckView; assetTag?: string; heldNotice?: boolean }) {
  // Coordinates named and without grouping, so "1,250" never reads as two of them; inputs are kept to 4 decimals.
  const { dateTime, coordinate, mm: millimetres } = useFirmFormat();
  const pointText = (p: { x: number; y: number; z: number }) => coordinate(p, 4);
  const mm = (v: number) => millimetres(v, 4);
  const r = check.result;
  let facts: { term: string; value: ReactNode; mono?: boolean }[] = [];
  if (check.kind === 'tip_validation') {
    facts = [
      { term: 'Position', value: positionWords[check.position] },
      { term: 'Reference point R', value: pointText(check.inputs.reference), mono: true },
      ...check.result.deviationsUm.map((d, i) => ({ term: `Reading ${i + 1}: distance from R`, value: um(d), mono: true })),
      { term: "Mean point's offset", value: um(check.result.meanOffsetUm), mono: true },
      { term: 'Spread', value: um(check.result.spreadUm), mono: true },
      { term: 'Largest deviation (judged)', value: um(check.result.maxDeviationUm), mono: true },
    ];
  } else if (check.kind === 'two_face') {
    facts = [
      { term: 'Front face', value: pointText(check.inputs.front), mono: true },
      { term: 'Back face', value: pointText(check.inputs.back), mono: true },
      { term: 'Two-face error (judged)', value: um(check.result.errorUm), mono: true },
    ];
  } else {
    facts = [
      { term: 'Scale bar', value: check.inputs.scaleBar.assetTag, mono: true },
      { term: 'Bar temperature', value: `${formatNumber(check.inputs.temperatureC, 1)} °C` },
      { term: 'Measured length', value: mm(check.result.measuredMm), mono: true },
      { term: 'Expected length', value: mm(check.result.expectedMm), mono: true },
      { term: 'Error (judged)', value: um(check.result.errorUm), mono: true },
    ];
  }
  facts.push(
    {
      term: 'Tolerance',
      value:
        check.inputs.tolerance.kind === 'range'
          ? `${um(r.toleranceUm)} (${toleranceText(check.inputs.tolerance)}, at ${formatNumber(check.inputs.distanceM ?? 0, 2)} m)`
          : um(r.toleranceUm),
    },
    { term: 'Expanded uncertainty U (k = 2)', value: um(r.expandedUncertaintyUm), mono: true },
    { term: 'Guard band', value: um(r.guardBandUm), mono: true },
    { term: 'Decision rule', value: decisionRuleWords[r.decisionRule] },
    { term: 'Performed', value: dateTime(check.performedAt) },
  );
  // A check recorded on a phone without signal reached the server later; both times are kept.
  if (Date.parse(check.recordedAt) - Date.parse(check.performedAt) > 10 * 60_000) facts.push({ term: 'Reached Nestkeeper', value: dateTime(check.recordedAt) });
  if (check.note) facts.push({ term: 'Note', value: check.note });

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        <DecisionMark decision={r.decision} size="lg" />
        <p className="text-lg font-semibold">
          {checkKindWords[check.kind]}
          {check.kind === 'tip_validation' ? ` (${positionWords[check.position].toLowerCase()})` : ''}:{' '}
          {r.decision === 'pass' ? 'within the acceptance limit' : 'beyond the acceptance limit'}
        </p>
      </div>
      {r.decision === 'fail' && heldNotice ? (
        <Notice tone="error" title={`${assetTag ?? 'This item'} is now on hold`}>
          It cannot be booked or sent out until it passes this check again or is recalibrated, and a shop manager or the owner releases it. The manager and the
          owner have been told by e-mail. Jobs it measured since its last good check may need a second look.
        </Notice>
      ) : null}
      <FactList items={facts} />
      {check.kind === 'tip_validation' ? (
        <ReadingsSketch reference={check.inputs.reference} readings={check.inputs.readings} toleranceUm={r.toleranceUm} />
      ) : null}
    </div>
  );
}
