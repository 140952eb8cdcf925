import type { ReactNode } from 'react';
import { FactList, Panel } from '../../../components/panel';
import { Link } from 'react-router-dom';
import { AssetStatusChip, CalibrationChip } from '../../../components/asset-status';
import { BatteryCaution, HeavyCaseCaution, LaserCaution } from '../../../components/safety-cautions';
import type { AssetView } from '../../../../shared/assets/views';
import { assetTypeTitles, typesWithFirmware } from '../../../lib/assets';
import { formatWattHours, shippingClass, shippingClassText, wattHours } from '../../../lib/batteries';
import { formatCalendarDate, formatCount, formatMoney, formatNumber, useFirmFormat } from '../../../lib/format';

export { FactList, Panel } from '../../../components/panel';

const num = (v: unknown) => (typeof v === 'number' ? v : null);

export function AssetIdentity({ asset }: { asset: AssetView }) {
  const { date } = useFirmFormat();
  return (
    <Panel title="Identity">
      <FactList
        items={[
          { term: 'Type', value: assetTypeTitles[asset.type] },
          { term: 'Status', value: <AssetStatusChip status={asset.status} /> },
          { term: 'Asset tag', value: asset.assetTag, mono: true },
          { term: 'Serial number', value: asset.serialNumber, mono: true },
          { term: 'Manufacturer', value: asset.manufacturer },
          { term: 'Model', value: asset.model },
          ...(typesWithFirmware.includes(asset.type) ? [{ term: 'Firmware', value: asset.firmwareVersion, mono: true }] : []),
          ...(asset.type === 'tip' ? [{ term: 'RFID tag', value: asset.rfidTag, mono: true }] : []),
          { term: 'Location', value: asset.location },
          { term: 'Replacement value', value: formatMoney(asset.replacementValueMinor, asset.currency) },
          {
            term: 'Kit',
            value: asset.kit ? (
              <Link to={`/kits/${asset.kit.id}`} className="font-semibold text-brass-deep underline">
                {asset.kit.name}
              </Link>
            ) : (
              'Not in a kit'
            ),
          },
          ...(asset.notes ? [{ term: 'Notes', value: <span className="whitespace-pre-line">{asset.notes}</span> }] : []),
          ...(asset.retiredAt ? [{ term: 'Retired', value: `${date(asset.retiredAt)} — ${asset.retiredReason ?? ''}` }] : []),
        ]}
      />
    </Panel>
  );
}

/** The type-specific facts; batteries also show their energy and shipping class. */
export function AssetSpecs({ asset }: { asset: AssetView }) {
  const s = asset.specs;
  const mm = (v: unknown) => (num(v) === null ? null : `${formatNumber(num(v)!, 4)} mm`);
  let items: { term: string; value: ReactNode }[] = [];
  let caution: ReactNode = null;
  switch (asset.type) {
    case 'tip':
      items = [
        { term: 'Tip length', value: mm(s.lengthMm) },
        {
          term: 'Mounting positions',
          value: Array.isArray(s.positions) ? (s.positions as string[]).map((p) => (p === 'vertical' ? 'Vertical' : 'Horizontal')).join(', ') : null,
        },
      ];
      break;
    case 'battery': {
      const v = num(s.nominalVoltageV);
      const ah = num(s.ratedCapacityAh);
      const wh = v !== null && ah !== null ? wattHours(v, ah) : null;
      items = [
        { term: 'Nominal voltage', value: v === null ? null : `${formatNumber(v, 2)} V` },
        { term: 'Rated capacity', value: ah === null ? null : `${formatNumber(ah, 3)} Ah` },
        { term: 'Energy', value: wh === null ? null : formatWattHours(wh) },
        { term: 'Shipping class', value: wh === null ? null : shippingClassText[shippingClass(wh, s.damaged === true)] },
        { term: 'Charge cycles', value: num(s.chargeCycles) === null ? null : formatCount(num(s.chargeCycles)!) },
        { term: 'Damaged', value: s.damaged === true ? 'Yes — do not charge, do not fly' : 'No' },
      ];
      caution = <BatteryCaution className="mt-3" />;
      break;
    }
    case 'smr':
    case 'reference_sphere':
      items = [{ term: 'Diameter', value: mm(s.diameterMm) }];
      break;
    case 'scale_bar':
      items = [
        { term: 'Certified length', value: mm(s.certifiedLengthMm) },
        { term: 'Expansion coefficient', value: num(s.expansionPpmPerK) === null ? null : `${formatNumber(num(s.expansionPpmPerK)!, 2)} µm/(m·K)` },
      ];
      break;
    case 'tracker':
      items = [
        { term: 'Laser class', value: typeof s.laserClass === 'string' ? s.laserClass : null },
        { term: 'Maximum range', value: num(s.maxRangeM) === null ? null : `${formatNumber(num(s.maxRangeM)!)} m` },
      ];
      caution = <LaserCaution laserClass={typeof s.laserClass === 'string' ? s.laserClass : null} className="mt-3" />;
      break;
    case 'nest':
      items = [{ term: 'Nest size', value: mm(s.sizeMm) }];
      break;
    case 'case':
      items = [{ term: 'Mass', value: num(s.massKg) === null ? null : `${formatNumber(num(s.massKg)!)} kg` }];
      caution = <HeavyCaseCaution className="mt-3" />;
      break;
    default:
      items = [];
  }
  return (
    <Panel title={`${assetTypeTitles[asset.type]} facts`}>
      {items.length ? <FactList items={items} /> : <p className="text-ink-700">This type has no extra facts.</p>}
      {caution}
    </Panel>
  );
}

export function AssetCalibration({ asset }: { asset: AssetView }) {
  const c = asset.calibration;
  return (
    <Panel title="Calibration">
      <FactList
        items={[
          { term: 'State', value: <CalibrationChip state={c.state} dueOn={c.dueOn} /> },
          { term: 'Required', value: c.required ? 'Yes' : 'No' },
          ...(c.required
            ? [
                { term: 'Interval', value: c.intervalMonths ? `${c.intervalMonths} ${c.intervalMonths === 1 ? 'month' : 'months'}` : null },
                { term: 'Provider', value: c.provider },
                { term: 'Last calibrated', value: c.lastCalibratedOn ? formatCalendarDate(c.lastCalibratedOn) : 'No calibration on record' },
                { term: 'Due date', value: c.dueOn ? `${formatCalendarDate(c.dueOn)} (valid through that day)` : null },
              ]
            : []),
        ]}
      />
    </Panel>
  );
}
