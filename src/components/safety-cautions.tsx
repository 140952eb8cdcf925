import { Notice } from './notice';

/** DESIGN.md §6: the cautions shown where they apply. They defer to the rules that actually govern. */
const defer = "Follow local codes, the carrier's rules and the instrument maker's instructions.";

export function BatteryCaution({ className }: { className?: string }) {
  return (
    <Notice tone="caution" title="Lithium-ion battery" className={className}>
      A battery that was dropped, is swollen or is otherwise damaged is a fire risk: do not charge it and do not ship it by air. Over 100 Wh needs the
      carrier&rsquo;s approval; over 160 Wh may not travel in passenger baggage. {defer}
    </Notice>
  );
}

export function LaserCaution({ laserClass, className }: { laserClass?: string | null; className?: string }) {
  return (
    <Notice tone="caution" title="Laser beam" className={className}>
      Laser trackers emit a visible beam ({laserClass ? `this one: ${laserClass}` : 'commonly IEC 60825-1 Class 2'}). Do not stare into the beam or point it at
      anyone&rsquo;s eyes. {defer}
    </Notice>
  );
}

export function HeavyCaseCaution({ className }: { className?: string }) {
  return (
    <Notice tone="caution" title="Heavy case" className={className}>
      Tracker cases are heavy: lift with two people or use a trolley. {defer}
    </Notice>
  );
}
