import { Field } from '../../../components/field';

/** Three labelled coordinates of one point, e.g. "Reference X (mm)". */
export function PointFields({ name, prefix, legend, hint }: { name: string; prefix: string; legend: string; hint?: string }) {
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 font-semibold text-ink-900">{legend}</legend>
      {hint ? <p className="-mt-1 text-sm text-ink-500">{hint}</p> : null}
      <div className="grid grid-cols-1 gap-2 sm:grid-cols-3">
        {(['x', 'y', 'z'] as const).map((axis) => (
          <Field
            key={axis}
            name={`${name}.${axis}`}
            label={`${prefix} ${axis.toUpperCase()} (mm)`}
            inputMode="decimal"
            autoComplete="off"
            spellCheck={false}
            mono
          />
        ))}
      </div>
    </fieldset>
  );
}
