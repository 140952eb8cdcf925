import * as Yup from 'yup';
import type { AssetView } from '../../../../shared/assets/views';
import { assetTypes, typesWithFirmware, type AssetType } from '../../../lib/assets';
import type { CreateAssetPayload, UpdateAssetPayload } from '../../../../shared/schemas/assets';

/** Numbers as Formik holds them: a number, or '' while the box is empty. */
type NumberInput = number | '';

export interface AssetFormValues {
  type: AssetType | '';
  assetTag: string;
  serialNumber: string;
  manufacturer: string;
  model: string;
  firmwareVersion: string;
  rfidTag: string;
  location: string;
  /** In major units as typed (e.g. 12500.50); sent as integer minor units. */
  replacementValue: NumberInput;
  notes: string;
  calibration: { required: boolean; intervalMonths: NumberInput; provider: string; lastCalibratedOn: string };
  specs: {
    lengthMm: NumberInput;
    positions: string[];
    nominalVoltageV: NumberInput;
    ratedCapacityAh: NumberInput;
    chargeCycles: NumberInput;
    damaged: boolean;
    diameterMm: NumberInput;
    certifiedLengthMm: NumberInput;
    expansionPpmPerK: NumberInput;
    laserClass: string;
    maxRangeM: NumberInput;
    sizeMm: NumberInput;
    massKg: NumberInput;
  };
}

/** The spec fields each type has, in the order the form shows them (server: specsByType). */
export const specFieldsByType: Record<AssetType, (keyof AssetFormValues['specs'])[]> = {
  tip: ['lengthMm', 'positions'],
  battery: ['nominalVoltageV', 'ratedCapacityAh', 'chargeCycles', 'damaged'],
  smr: ['diameterMm'],
  reference_sphere: ['diameterMm'],
  scale_bar: ['certifiedLengthMm', 'expansionPpmPerK'],
  tracker: ['laserClass', 'maxRangeM'],
  controller: [],
  probe: [],
  nest: ['sizeMm'],
  weather_station: [],
  case: ['massKg'],
  accessory: [],
};

/** Field labels, also used to word the server's short messages ("is required"). */
export const assetFieldLabels: Record<string, string> = {
  type: 'Type',
  assetTag: 'Asset tag',
  serialNumber: 'Serial number',
  manufacturer: 'Manufacturer',
  model: 'Model',
  firmwareVersion: 'Firmware version',
  rfidTag: 'RFID tag',
  location: 'Location',
  replacementValue: 'Replacement value',
  notes: 'Notes',
  'calibration.required': 'Calibration required',
  'calibration.intervalMonths': 'Interval (months)',
  'calibration.provider': 'Calibration provider',
  'calibration.lastCalibratedOn': 'Last calibrated on',
  'specs.lengthMm': 'Tip length (mm)',
  'specs.positions': 'Mounting positions',
  'specs.nominalVoltageV': 'Nominal voltage (V)',
  'specs.ratedCapacityAh': 'Rated capacity (Ah)',
  'specs.chargeCycles': 'Charge cycles',
  'specs.damaged': 'Damaged',
  'specs.diameterMm': 'Diameter (mm)',
  'specs.certifiedLengthMm': 'Certified length (mm)',
  'specs.expansionPpmPerK': 'Expansion coefficient (µm/(m·K))',
  'specs.laserClass': 'Laser class',
  'specs.maxRangeM': 'Maximum range (m)',
  'specs.sizeMm': 'Nest size (mm)',
  'specs.massKg': 'Mass (kg)',
};
export const assetFormFields = Object.keys(assetFieldLabels);

const number = (what: string) =>
  Yup.number()
    .transform((value, original) => (original === '' || original === null ? undefined : value))
    .typeError(`${what} must be a number.`);
const positive = (what: string, max: number) => number(what).moreThan(0, `${what} must be more than 0.`).max(max, `${what} looks too large (at most ${max}).`);
const text = (what: string, max: number) => Yup.string().trim().max(max, `${what} must be at most ${max} characters.`);

function specsSchema(type: AssetType | '') {
  switch (type) {
    case 'tip':
      return Yup.object({
        lengthMm: positive('The tip length', 100_000).required('Enter the tip length in millimetres.'),
        positions: Yup.array(Yup.string()).min(1, 'Tick at least one mounting position.'),
      });
    case 'battery':
      return Yup.object({
        nominalVoltageV: positive('The nominal voltage', 1000).required('Enter the nominal voltage from the battery’s label.'),
        ratedCapacityAh: positive('The rated capacity', 1000).required('Enter the rated capacity from the battery’s label.'),
        chargeCycles: number('The charge-cycle count').integer('Charge cycles are a whole number.').min(0, 'Charge cycles cannot be negative.'),
      });
    case 'smr':
    case 'reference_sphere':
      return Yup.object({ diameterMm: positive('The diameter', 100_000).required('Enter the diameter in millimetres.') });
    case 'scale_bar':
      return Yup.object({
        certifiedLengthMm: positive('The certified length', 100_000).required('Enter the certified length in millimetres.'),
        expansionPpmPerK: number('The expansion coefficient')
          .min(-50, 'The expansion coefficient should be between −50 and 100 µm/(m·K).')
          .max(100, 'The expansion coefficient should be between −50 and 100 µm/(m·K).')
          .required('Enter the expansion coefficient (steel is about 11.5, invar about 1.2).'),
      });
    case 'tracker':
      return Yup.object({ laserClass: text('The laser class', 20), maxRangeM: positive('The range', 100_000) });
    case 'nest':
      return Yup.object({ sizeMm: positive('The nest size', 100_000) });
    case 'case':
      return Yup.object({ massKg: positive('The mass', 500) });
    default:
      return Yup.object({});
  }
}

export function assetFormSchema(values: AssetFormValues) {
  return Yup.object({
    type: Yup.string()
      .oneOf(assetTypes as readonly string[], 'Choose what kind of item this is.')
      .required('Choose what kind of item this is.'),
    assetTag: Yup.string()
      .trim()
      .required('Enter the asset tag — your firm’s own label, such as TRK-004.')
      .max(40, 'Keep the asset tag to 40 characters.')
      .matches(/^[A-Za-z0-9][A-Za-z0-9._\-/]*$/, 'Start with a letter or digit, and use only letters, digits and . _ - /'),
    serialNumber: text('The serial number', 80).required('Enter the maker’s serial number.'),
    manufacturer: text('The manufacturer', 80),
    model: text('The model', 80),
    firmwareVersion: text('The firmware version', 40),
    rfidTag: text('The RFID tag', 64).matches(/^[A-Za-z0-9:-]*$/, 'An RFID tag uses only letters, digits, : and -'),
    location: text('The location', 120),
    replacementValue: number('The replacement value').min(0, 'The replacement value cannot be negative.'),
    notes: text('The notes', 4000),
    calibration: Yup.object({
      required: Yup.boolean(),
      intervalMonths: values.calibration.required
        ? number('The interval')
            .integer('Give the interval in whole months.')
            .min(1, 'The interval must be at least 1 month.')
            .max(120, 'The interval must be at most 120 months.')
            .required('Enter how many months a calibration holds.')
        : number('The interval')
            .integer('Give the interval in whole months.')
            .min(1, 'The interval must be at least 1 month.')
            .max(120, 'The interval must be at most 120 months.'),
      provider: text('The provider', 120),
      lastCalibratedOn: Yup.string()
        .matches(/^\d{4}-\d{2}-\d{2}$/, { message: 'Enter a date.', excludeEmptyString: true })
        .test('not-future', 'The last calibration cannot be in the future.', (v) => !v || v <= new Date(Date.now() + 86_400_000).toISOString().slice(0, 10)),
    }),
    specs: specsSchema(values.type),
  });
}

export function emptyAssetFormValues(): AssetFormValues {
  return {
    type: '',
    assetTag: '',
    serialNumber: '',
    manufacturer: '',
    model: '',
    firmwareVersion: '',
    rfidTag: '',
    location: '',
    replacementValue: '',
    notes: '',
    calibration: { required: true, intervalMonths: 12, provider: '', lastCalibratedOn: '' },
    specs: {
      lengthMm: '',
      positions: [],
      nominalVoltageV: '',
      ratedCapacityAh: '',
      chargeCycles: '',
      damaged: false,
      diameterMm: '',
      certifiedLengthMm: '',
      expansionPpmPerK: '',
      laserClass: '',
      maxRangeM: '',
      sizeMm: '',
      massKg: '',
    },
  };
}

const asNumber = (v: unknown): NumberInput => (typeof v === 'number' && Number.isFinite(v) ? v : '');

export function assetToFormValues(asset: AssetView, digits: number): AssetFormValues {
  const empty = emptyAssetFormValues();
  const s = asset.specs;
  return {
    type: asset.type,
    assetTag: asset.assetTag,
    serialNumber: asset.serialNumber,
    manufacturer: asset.manufacturer ?? '',
    model: asset.model ?? '',
    firmwareVersion: asset.firmwareVersion ?? '',
    rfidTag: asset.rfidTag ?? '',
    location: asset.location ?? '',
    replacementValue: asset.replacementValueMinor === null ? '' : asset.replacementValueMinor / 10 ** digits,
    notes: asset.notes ?? '',
    calibration: {
      required: asset.calibration.required,
      intervalMonths: asNumber(asset.calibration.intervalMonths),
      provider: asset.calibration.provider ?? '',
      lastCalibratedOn: asset.calibration.lastCalibratedOn ?? '',
    },
    specs: {
      ...empty.specs,
      lengthMm: asNumber(s.lengthMm),
      positions: Array.isArray(s.positions) ? (s.positions as string[]) : [],
      nominalVoltageV: asNumber(s.nominalVoltageV),
      ratedCapacityAh: asNumber(s.ratedCapacityAh),
      chargeCycles: asNumber(s.chargeCycles),
      damaged: s.damaged === true,
      diameterMm: asNumber(s.diameterMm),
      certifiedLengthMm: asNumber(s.certifiedLengthMm),
      expansionPpmPerK: asNumber(s.expansionPpmPerK),
      laserClass: typeof s.laserClass === 'string' ? s.laserClass : '',
      maxRangeM: asNumber(s.maxRangeM),
      sizeMm: asNumber(s.sizeMm),
      massKg: asNumber(s.massKg),
    },
  };
}

/** The payload for POST (empty fields left out) or PATCH (empty fields cleared with null). */
export function formValuesToPayload(values: AssetFormValues, mode: 'create' | 'edit', digits: number): CreateAssetPayload | UpdateAssetPayload {
  const type = values.type as AssetType;
  const empty = mode === 'create' ? undefined : null;
  const optional = (v: string) => (v.trim() ? v.trim() : empty);
  const specs: Record<string, unknown> = {};
  for (const key of specFieldsByType[type]) {
    const value = values.specs[key];
    if (key === 'damaged') specs.damaged = value === true;
    else if (key === 'positions') specs.positions = value;
    else if (key === 'laserClass') {
      if (values.specs.laserClass.trim()) specs.laserClass = values.specs.laserClass.trim();
    } else if (value !== '') specs[key] = value;
  }
  const cal = values.calibration;
  const payload: UpdateAssetPayload = {
    assetTag: values.assetTag.trim(),
    serialNumber: values.serialNumber.trim(),
    manufacturer: optional(values.manufacturer),
    model: optional(values.model),
    location: optional(values.location),
    notes: optional(values.notes),
    replacementValueMinor: values.replacementValue === '' ? empty : Math.round(values.replacementValue * 10 ** digits),
    calibration: {
      required: cal.required,
      intervalMonths: cal.intervalMonths === '' ? null : cal.intervalMonths,
      provider: cal.provider.trim() || null,
      lastCalibratedOn: cal.lastCalibratedOn || null,
    },
    specs,
  };
  if (type === 'tip') payload.rfidTag = optional(values.rfidTag);
  if (typesWithFirmware.includes(type)) payload.firmwareVersion = optional(values.firmwareVersion);
  return mode === 'create' ? { type, ...payload } : payload;
}
